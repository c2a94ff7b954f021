// Cautions for working at a test rig: where a tool is run against an anvil or a fixture over and over,
// guarding and mounting matter as much as the tool. Defers to the maker's instructions and local codes.
export function BenchSafetyCautions() {
  return (
    <aside
      aria-labelledby="bench-safety-heading"
      className="rounded-lg border-l-4 border-signal-500 bg-signal-100 p-4 text-sm text-stone-800"
    >
      <h2 id="bench-safety-heading" className="mb-2 font-semibold">
        Working at a rig
      </h2>
      <ul className="list-disc space-y-1 pl-5">
        <li>
          Guarding around the rig on every side a bit, a fragment or a socket could leave by; nobody in line with it.
        </li>
        <li>The rig bolted down to the floor or a bench made for it; a loose rig walks and throws the tool.</li>
        <li>The tool's bit retainer fitted and in good order, and only bits or sockets made for its shank or drive.</li>
        <li>No shank adapters: they are a known failure hazard under repeated blows.</li>
        <li>Eye protection and hearing protection for everyone at the rig; a rig run is loud and long.</li>
        <li>Air off and the line bled before changing a bit, a socket or the fixture.</li>
        <li>
          Never above the tool's rated inlet pressure; the open-line series set the regulator, not the tool, high.
        </li>
      </ul>
      <p className="mt-2 text-stone-700">
        The maker's instructions for the tool and the rig, local codes and licensed practice come first. A protocol here
        says what was measured, not how to run a rig safely in your shop.
      </p>
    </aside>
  );
}
