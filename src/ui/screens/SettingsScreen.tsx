export function SettingsScreen() {
  return (
    <section aria-labelledby="settings-h">
      <h2 id="settings-h">Settings</h2>
      <p>Nothing here yet.</p>
    </section>
  );
}
