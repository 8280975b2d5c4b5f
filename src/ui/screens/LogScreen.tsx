export function LogScreen() {
  return (
    <section aria-labelledby="log-h">
      <h2 id="log-h">Log</h2>
      <p>Nothing here yet.</p>
    </section>
  );
}
