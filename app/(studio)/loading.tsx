export default function Loading() {
  return (
    <p role="status" className="py-12 text-center text-graphite-faint">
      Laying out the board…
    </p>
  );
}
