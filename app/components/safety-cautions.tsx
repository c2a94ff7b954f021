// The usual cautions for percussive and impact air tools. Sources beside each line; the page
// always defers to the maker's instructions, local codes and licensed practice.
export function SafetyCautions({ action }: { action: "percussive" | "rotary" }) {
  return (
    <aside
      aria-labelledby="safety-heading"
      className="rounded-lg border-l-4 border-signal-500 bg-signal-100 p-4 text-sm text-stone-800"
    >
      <h2 id="safety-heading" className="mb-2 font-semibold">
        Before you pull the trigger
      </h2>
      <ul className="list-disc space-y-1 pl-5">
        <li>Eye protection for you and anyone near the bay; parts and bits can fly.</li>
        <li>
          Hearing protection: air hammers and impact wrenches run well above the 85 dBA action level (OSHA 29 CFR
          1910.95).
        </li>
        {action === "percussive" ? (
          <>
            <li>
              A bit retainer fitted and in good order, so the bit cannot leave the tool (OSHA 29 CFR 1910.243(b)(1)).
            </li>
            <li>
              Use bits made for your tool's shank (0.401 in or 0.498 in); never a shank adapter — they are a known
              failure hazard.
            </li>
          </>
        ) : (
          <li>Impact-rated sockets only; chrome hand sockets can shatter under impact.</li>
        )}
        <li>Never point the tool at anyone, and never run it above its rated inlet pressure.</li>
        <li>
          Secure hoses and couplers; a hose that parts under pressure whips. Disconnect the air before changing bits or
          sockets.
        </li>
      </ul>
      <p className="mt-2 text-stone-700">
        The maker's instructions, local codes and licensed practice come first. Bayproof reports what technicians did;
        it is not a procedure.
      </p>
    </aside>
  );
}
