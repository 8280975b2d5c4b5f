import { useState } from 'preact/hooks';

export function PlanScreen() {
  const [height, setHeight] = useState<number | null>(10);
  return (
    <section aria-labelledby="plan-h">
      <h2 id="plan-h">Try a drop before you make it</h2>
      <pl-quantity
        label="Release height"
        quantity="length"
        value={height}
        min={0}
        minExclusive
        max={5000}
        required
        onquantity-change={(e: CustomEvent) => setHeight((e.detail as { value: number | null }).value)}
      />
      <p class="big-number" aria-live="polite">{height === null ? '—' : `${height} m`}</p>
    </section>
  );
}
