/** The cautions a crew should read before dropping anything; shown before a day's first series and on the planner. */
export function SafetyCaution({ onAcknowledge }: { onAcknowledge?: () => void }) {
  return (
    <aside class="caution" aria-labelledby="caution-h">
      <h3 id="caution-h">Before you drop anything</h3>
      <ul>
        <li>Clear the landing zone and watch it during every drop: nobody below, nobody walking in.</li>
        <li>Post spotters; everyone near the drop or the landing zone wears head protection.</li>
        <li>Secure the release point and the person releasing: harness or railing at any edge.</li>
        <li>Mind the wind: it carries light specimens far from the planned landing point.</li>
        <li>
          Drops from buildings, bridges, cranes and aircraft — crewed or unmanned — need the permissions that local
          rules require. Follow them and your organisation’s procedures.
        </li>
        <li>These numbers are no substitute for a qualified safety assessment.</li>
      </ul>
      {onAcknowledge ? (
        <button type="button" class="btn" onClick={onAcknowledge}>
          Understood: the zone is clear
        </button>
      ) : null}
    </aside>
  );
}

/** Impact energies above which we warn. Sources: rules of thumb, not a safety standard (common practice). */
const IMPACT_ENERGY_WARN_J = 40;
const IMPACT_ENERGY_SEVERE_J = 80;

export function impactEnergyWarning(energyJ: number | null | undefined): string | null {
  if (energyJ === null || energyJ === undefined || !Number.isFinite(energyJ)) return null;
  if (energyJ >= IMPACT_ENERGY_SEVERE_J)
    return 'This impact could cause serious or fatal head injury. Nobody may be anywhere near the landing zone.';
  if (energyJ >= IMPACT_ENERGY_WARN_J) return 'This impact is enough to injure someone it hits. Keep the landing zone clear.';
  return null;
}
