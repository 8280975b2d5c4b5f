// @vitest-environment happy-dom
import { describe, expect, it } from 'vitest';
import { act, render, waitFor } from '@testing-library/preact';
import { createMemoryStore, type LogStore } from '../../src/store';
import { AppProvider, DEFAULT_SETTINGS } from '../../src/ui/app-context';
import { useDraft } from '../../src/ui/hooks';

/** A store whose draft reads wait until released, like a slow phone. */
function slowDrafts(store: LogStore): { store: LogStore; release(): void } {
  let release!: () => void;
  const gate = new Promise<void>((r) => (release = r));
  return { store: { ...store, getDraft: (key: string) => gate.then(() => store.getDraft(key)) } as LogStore, release };
}

function probe() {
  const seen: { value: { text: string }; set(p: { text: string }): void }[] = [];
  function Form() {
    const form = useDraft<{ text: string }>('form', () => ({ text: '' }));
    seen.push(form);
    return <p>{form.value.text}</p>;
  }
  return { Form, last: () => seen[seen.length - 1]! };
}

describe('a form draft', () => {
  it('comes back after the form is opened again', async () => {
    const store = await createMemoryStore();
    await store.putDraft('form', { text: 'half-typed' });
    const { Form, last } = probe();
    render(
      <AppProvider store={store} initialSettings={DEFAULT_SETTINGS}>
        <Form />
      </AppProvider>,
    );
    await waitFor(() => expect(last().value.text).toBe('half-typed'));
  });

  it('never replaces what was typed before the stored draft was read', async () => {
    const base = await createMemoryStore();
    await base.putDraft('form', { text: 'an old draft' });
    const { store, release } = slowDrafts(base);
    const { Form, last } = probe();
    render(
      <AppProvider store={store} initialSettings={DEFAULT_SETTINGS}>
        <Form />
      </AppProvider>,
    );
    act(() => last().set({ text: 'typed at once' }));
    await act(async () => {
      release();
      await new Promise((r) => setTimeout(r, 20));
    });
    expect(last().value.text).toBe('typed at once');
  });
});
