// Used as loading.tsx in the signed-in areas. Not at the root: a root loading boundary makes every page stream,
// and a streamed notFound() answers 200 instead of 404.
export function LoadingView() {
  return (
    <div
      role="status"
      aria-busy="true"
      aria-live="polite"
      className="mx-auto flex w-full max-w-shell flex-1 flex-col items-center justify-center gap-4 px-4 py-20"
    >
      {/* Three bow strokes rising in turn; reduced-motion users get them still (globals.css). */}
      <div aria-hidden="true" className="flex h-10 items-end gap-1.5">
        {[0, 150, 300].map((delay) => (
          <span
            key={delay}
            className="block h-10 w-2 origin-bottom animate-pulse rounded-full bg-cedar"
            style={{ animationDelay: `${delay}ms` }}
          />
        ))}
      </div>
      <p className="text-bark">Loading…</p>
    </div>
  );
}
