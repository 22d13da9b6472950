/** A wait, said in words for screen readers and shown as a turning ring (still when motion is reduced). */
export function Spinner({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-2 py-4 text-sm text-muted">
      <span aria-hidden="true" className="inline-block size-4 rounded-full border-2 border-line border-t-accent motion-safe:animate-spin" />
      <span>{label}</span>
    </div>
  );
}
