export interface PureCallFinding {
  file: string;
  line: number;
  column: number;
  rule: 'no-clock' | 'no-randomness';
  message: string;
}
export function checkPureCalls(root?: string, project?: string): { files: number; findings: PureCallFinding[] };
