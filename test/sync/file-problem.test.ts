// What sync says about a file it skipped: the file's phone, the record and the field, read from the refusal.
import { describe, expect, it } from 'vitest';
import { LogValidationError } from '../../src/log/errors';
import { exportLog } from '../../src/log/export';
import { LogFileError, readLogFile } from '../../src/log/export-parse';
import { describeFileProblem, fileProblem, problemWeight } from '../../src/sync/file-problem';
import { byKind, sampleLog } from './sample-log';

const log = sampleLog({ device: 'phoneB', seed: 2 });
const text = exportLog(log, { device: 'phoneB', app_version: '0.1.0' });

function refusal(bad: string): LogFileError {
  try {
    readLogFile(bad);
  } catch (error) {
    if (error instanceof LogFileError) return error;
    throw error;
  }
  throw new Error('the file was accepted');
}

describe('fileProblem', () => {
  it('names the record and field of a record the file check refuses, and the phone from the header', () => {
    const drop = byKind(log, 'drop')[0]!;
    const bad = exportLog(log.map((r) => (r.id === drop.id ? { ...r, time_s: -1 } : r)), { device: 'phoneB', app_version: '0.1.0' });
    const problem = fileProblem(refusal(bad), bad);
    expect(problem).toMatchObject({ device: 'phoneB', record: drop.id, field: 'time_s', value: '-1' });
    expect(problem.code).toMatch(/^log-/);
  });

  it('names the phone of a truncated file from the start of its text', () => {
    const cut = text.slice(0, 300);
    const problem = fileProblem(refusal(cut), cut);
    expect(problem.device).toBe('phoneB');
    expect(problem.record).toBeNull();
  });

  it('names the record of a batch the store refuses, by the id in its message', () => {
    const drop = byKind(log, 'drop')[0]!;
    const error = new LogValidationError(
      [{ path: '[0].series_id', value: undefined, rule: 'must be a UUID', message: `[0] drop ${drop.id}: series_id: missing: must be a UUID` }],
      'record',
    );
    const file = readLogFile(text);
    expect(fileProblem(error, text, file)).toMatchObject({ code: 'record-invalid', device: 'phoneB', record: drop.id, field: 'series_id' });
  });

  it('cuts a message that echoes a long text, and a long device name', () => {
    const huge = `{"device":"${'p'.repeat(5000)}","format":"x"}`;
    const problem = fileProblem(new Error(`bad: ${'x'.repeat(100_000)}`), huge);
    expect(problem.message.length).toBeLessThanOrEqual(400);
    expect(problem.device!.length).toBeLessThanOrEqual(120);
    expect(problem.code).toBe('Error');
  });

  it('tells a refused file from a phone that could not take it in now, and from a store that cannot be used', () => {
    expect(problemWeight(refusal('{}'))).toBe('file');
    expect(problemWeight(new LogValidationError([], 'drop'))).toBe('file');
    expect(problemWeight(new RangeError('Maximum call stack size exceeded'))).toBe('file');
    expect(problemWeight({ name: 'StoreError', code: 'storage-full' })).toBe('passing');
    expect(problemWeight({ name: 'QuotaExceededError' })).toBe('passing');
    expect(problemWeight({ name: 'StoreError', code: 'store-closed' })).toBe('fatal');
    expect(problemWeight({ name: 'StoreError', code: 'database-newer' })).toBe('fatal');
  });

  it('reads as one line naming the file, the phone, the record and the field', () => {
    expect(describeFileProblem('plummet-log-phoneB.json', { code: 'record-invalid', message: 'must be > 0', device: 'phoneB', record: 'abc', field: 'time_s' })).toBe(
      'plummet-log-phoneB.json (phone phoneB), record abc, field time_s: must be > 0',
    );
    expect(describeFileProblem('notes.json', { code: 'log-not-a-log', message: 'not a log' })).toBe('notes.json: not a log');
  });
});
