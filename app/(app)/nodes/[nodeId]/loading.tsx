/** While the server reads the node: the page's frame, quietly pulsing. */
export default function NodeLoading() {
  return (
    <div aria-busy="true" aria-label="Loading the node" className="animate-pulse">
      <div className="h-3 w-32 rounded bg-dusk-800" />
      <div className="mt-3 h-7 w-56 rounded bg-dusk-800" />
      <div className="mt-5 h-9 w-full max-w-md rounded bg-dusk-900" />
      <div className="mt-5 grid grid-cols-2 gap-2 sm:grid-cols-3 lg:grid-cols-4">
        {Array.from({ length: 8 }, (_, i) => <div key={i} className="h-20 rounded-lg bg-dusk-900" />)}
      </div>
      <div className="mt-8 h-64 rounded-lg bg-dusk-900" />
    </div>
  );
}
