/**
 * When is the log at risk of being lost? Browsers may erase a site's storage on their own: some phone
 * browsers clear the data of a site not installed to the home screen after about a week without a visit,
 * and any browser may evict storage that is not persistent when the device runs short of space.
 */
import type { RiskReason } from './types';

/** Above this share of the quota, the phone is close to refusing writes. */
export const NEARLY_FULL_SHARE = 0.9;

export interface RiskFacts {
  erased: boolean;
  persistent: boolean | null;
  installed: boolean | null;
  unsentChanges: number;
  usage_bytes: number | null;
  quota_bytes: number | null;
}

export function assessRisk(facts: RiskFacts): RiskReason[] {
  const reasons: RiskReason[] = [];
  if (facts.erased) reasons.push('log-erased');
  if (facts.installed === false) reasons.push('not-installed');
  // Unknown counts as not persistent: nothing has promised to keep the data.
  if (facts.persistent !== true) reasons.push('not-persistent');
  if (facts.unsentChanges > 0) reasons.push('unsent-changes');
  if (facts.usage_bytes !== null && facts.quota_bytes !== null && facts.quota_bytes > 0) {
    if (facts.usage_bytes / facts.quota_bytes >= NEARLY_FULL_SHARE) reasons.push('storage-nearly-full');
  }
  return reasons;
}

/** Plain words for each reason, with the way out. */
export const RISK_MESSAGES: Record<RiskReason, string> = {
  'log-erased':
    'The browser erased the log that was stored on this phone (it can do so when the phone runs out of space). Import your last export, or sync, to get the records back.',
  'not-installed':
    'Plummet is not installed on the home screen. Some phone browsers erase the data of a site after about a week without a visit. Install it, or export the log.',
  'not-persistent':
    'The browser has not promised to keep Plummet’s data and may erase it when the phone runs short of space. Export or sync the log.',
  'unsent-changes': 'Some records changed since the last export or sync. Export or sync before you leave the site.',
  'storage-nearly-full': 'The storage for Plummet is nearly full. Export or sync the log and free space on the phone.',
};
