// @vitest-environment happy-dom
// A specimen form opened before another tab renamed the specimen: its save is refused ("changed elsewhere:
// reload") instead of putting the old name back, and the crew can reload the stored specimen and save again.
import { afterEach, describe, expect, it } from 'vitest';
import { cleanup, fireEvent, render, waitFor } from '@testing-library/preact';
import { createMemoryStore, MemoryDatabase } from '../../src/store';
import { AppProvider, DEFAULT_SETTINGS } from '../../src/ui/app-context';
import { SpecimensScreen } from '../../src/ui/screens/SpecimensScreen';
import * as demo from '../log/demo-bodies';

afterEach(() => cleanup());

describe('the specimen form in two tabs', () => {
  it('refuses a save from a form opened before another tab renamed the specimen, then saves after a reload', async () => {
    const database = new MemoryDatabase();
    const tabA = await createMemoryStore({ database });
    const tabB = await createMemoryStore({ database });
    const specimen = await tabA.create('specimen', { ...demo.steelBall(), name: 'Steel ball' });
    const { container, findByText, getByText } = render(
      <AppProvider store={tabA} initialSettings={DEFAULT_SETTINGS}>
        <SpecimensScreen params={[specimen.id]} />
      </AppProvider>,
    );
    await findByText('Edit Steel ball');
    const name = container.querySelector('#spec-name') as HTMLInputElement;
    await waitFor(() => expect(name.value).toBe('Steel ball'));

    await tabB.revise('specimen', specimen.id, { name: 'Steel ball 25 mm' });
    fireEvent.input(name, { target: { value: 'Steel ball (old form)' } });
    fireEvent.click(getByText('Save changes'));
    await findByText(/changed elsewhere: reload/);
    expect((await tabA.get('specimen', specimen.id))!.name).toBe('Steel ball 25 mm');

    fireEvent.click(getByText('Reload the specimen'));
    await waitFor(() => expect((container.querySelector('#spec-name') as HTMLInputElement).value).toBe('Steel ball 25 mm'));
    const notes = container.querySelector('#spec-notes') as HTMLTextAreaElement;
    fireEvent.input(notes, { target: { value: 'checked after the reload' } });
    fireEvent.click(getByText('Save changes'));
    await waitFor(async () => expect((await tabA.get('specimen', specimen.id))!.notes).toBe('checked after the reload'));
    expect((await tabA.get('specimen', specimen.id))!.name).toBe('Steel ball 25 mm');
  });
});
