// What a bench run is, in a few plain paragraphs for the bench page.
export function BenchIntro() {
  return (
    <div className="space-y-2 text-stone-800">
      <p>
        A bench run measures one tool on a rig: an air hammer strikes a calibrated load cell, or an impact wrench turns
        a torque fixture, and the peak of every blow is recorded. Each run follows a declared protocol version: the
        series (full trigger, the lightest steady trigger, an open shop line), how many trials, how long each, the bit
        and the warm-up.
      </p>
      <p>
        The trial is the unit of replication, not the blow: figures are the mean of the trial means with a t interval,
        beside the spread of the blows. Rigs carry their calibration and measure a check standard at the start of every
        session; a session outside its control limits holds its runs for review. Runs are moderated like reports. There
        is no points total and no single ranking here.
      </p>
    </div>
  );
}
