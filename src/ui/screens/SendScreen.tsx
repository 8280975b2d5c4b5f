export function SendScreen() {
  return (
    <section aria-labelledby="send-h">
      <h2 id="send-h">Send</h2>
      <p>Nothing here yet.</p>
    </section>
  );
}
