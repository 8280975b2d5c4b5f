import { RISK_MESSAGES } from '../store';
import { useApp } from './app-context';
import { Notice } from './forms';
import { routeHref } from './router';

/** Plain warnings while the log could be lost: not installed, storage not persistent, unsent changes. */
export function RiskWarnings({ compact = false }: { compact?: boolean }) {
  const { status } = useApp();
  if (!status || !status.atRisk) return null;
  return (
    <Notice tone="warn" title="This log could still be lost">
      <ul>
        {status.reasons.map((r) => (
          <li key={r}>{RISK_MESSAGES[r]}</li>
        ))}
      </ul>
      {compact ? null : (
        <p>
          <a href={routeHref('send')}>Export or sync now</a>
          {status.reasons.includes('not-installed') ? ' · use the browser menu’s “Install” or “Add to Home screen”.' : ''}
        </p>
      )}
    </Notice>
  );
}
