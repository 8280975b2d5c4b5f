// @vitest-environment happy-dom
import { describe, expect, it } from 'vitest';
import '../../src/widgets/quantity-input';
import type { QuantityChangeDetail, QuantityInput } from '../../src/widgets/quantity-input';

async function make(props: Partial<QuantityInput>): Promise<QuantityInput> {
  const el = document.createElement('pl-quantity');
  Object.assign(el, props);
  document.body.append(el);
  await el.updateComplete;
  return el;
}

function type(el: QuantityInput, text: string): QuantityChangeDetail {
  let detail: QuantityChangeDetail | null = null;
  el.addEventListener('quantity-change', (e) => (detail = (e as CustomEvent<QuantityChangeDetail>).detail), { once: true });
  const input = el.shadowRoot!.querySelector('input')!;
  input.value = text;
  input.dispatchEvent(new Event('input'));
  return detail!;
}

describe('<pl-quantity>', () => {
  it('gives the SI value of what is typed in the display unit', async () => {
    const el = await make({ label: 'Mass', quantity: 'mass', unit: 'g', min: 0, minExclusive: true, max: 10 });
    const d = type(el, '210');
    expect(d).toEqual({ value: 0.21, text: '210', error: null });
  });

  it('names the field, the value and the allowed range when out of range, and keeps the value null', async () => {
    const el = await make({ label: 'Relative humidity', quantity: 'percent', min: 0, max: 100 });
    const d = type(el, '120');
    expect(d.value).toBeNull();
    expect(d.error).toBe('Relative humidity: 120 % is out of range. Allowed: 0 to 100 %.');
    await el.updateComplete;
    expect(el.shadowRoot!.querySelector('[role="alert"]')?.textContent).toBe(d.error);
    expect(el.shadowRoot!.querySelector('input')!.getAttribute('aria-invalid')).toBe('true');
  });

  it('accepts a decimal comma and refuses text that is not a number', async () => {
    const el = await make({ label: 'Release height', quantity: 'length', unit: 'ft', min: 0, max: 100 });
    expect(type(el, '12,5').value).toBeCloseTo(12.5 * 0.3048, 12);
    expect(type(el, 'twelve').error).toBe('Release height: "twelve" is not a number. Allowed: 0 to 328.08 ft.');
  });

  it('shows an SI value handed in, in its display unit', async () => {
    const el = await make({ label: 'Air temperature', quantity: 'temperature', unit: '°F', value: 100 });
    expect(el.shadowRoot!.querySelector('input')!.value).toBe('212');
  });

  it('gives a signed field a sign key, since many phone keypads have no minus, and only a signed field', async () => {
    const el = await make({ label: 'Longitude', quantity: 'angle', min: -180, max: 180 });
    type(el, '8.5');
    const changes: QuantityChangeDetail[] = [];
    el.addEventListener('quantity-change', (e) => changes.push((e as CustomEvent<QuantityChangeDetail>).detail));
    const key = el.shadowRoot!.querySelector('button.sign') as HTMLButtonElement;
    expect(key.getAttribute('aria-label')).toBe('Change the sign of Longitude');
    key.click();
    expect(changes.at(-1)).toEqual({ value: -8.5, text: '-8.5', error: null });
    key.click();
    expect(changes.at(-1)).toEqual({ value: 8.5, text: '8.5', error: null });
    const mass = await make({ label: 'Mass', quantity: 'mass', unit: 'g', min: 0, minExclusive: true, max: 10 });
    expect(mass.shadowRoot!.querySelector('button.sign')).toBeNull();
  });
});
