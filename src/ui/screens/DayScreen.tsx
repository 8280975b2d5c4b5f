export function DayScreen({ params }: { params: string[] }) {
  return (
    <section aria-labelledby="day-h">
      <h2 id="day-h">Today’s tests</h2>
      <p>No test day started yet. {params.length ? '' : ''}</p>
    </section>
  );
}
