export default function Loading() {
  return (
    <p role="status" className="text-graphite-faint">
      One moment…
    </p>
  );
}
