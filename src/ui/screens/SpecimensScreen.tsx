export function SpecimensScreen({ params }: { params: string[] }) {
  return (
    <section aria-labelledby="specimens-h">
      <h2 id="specimens-h">Specimens</h2>
      <p>The specimen catalogue is empty.{params.length ? '' : ''}</p>
    </section>
  );
}
