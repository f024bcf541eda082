/** Last-resort screen when the whole app failed to render: says so and offers a reload. */
export function MainErrorFallback() {
  return (
    <div role="alert" className="mx-auto max-w-xl px-4 py-16 text-center">
      <h1 className="font-serif text-2xl font-semibold">Edgeledger could not start</h1>
      <p className="mt-2 text-muted">Something went wrong while showing this page. Reloading usually helps.</p>
      <button
        type="button"
        className="mt-6 rounded-md border border-accent bg-accent px-4 py-2 font-medium text-white"
        onClick={() => window.location.reload()}
      >
        Reload
      </button>
    </div>
  );
}
