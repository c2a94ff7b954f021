// A valid report form in imperial units, for tests to break one field at a time.
export const validReport = (): Record<string, string> => ({
  pu: "psi", lu: "in",
  toolModel: "brackwater-bh-150", jobType: "ball-joint-separation",
  vehicleClass: "passenger_car", corrosion: "heavy", componentAge: "12",
  attachment: "pickle fork", attachmentLength: "7",
  regulator: "100", inlet: "92", inletSource: "measured_at_inlet",
  hoseId: "3/8", hoseLength: "50", couplerProfile: "industrial_m", couplerCount: "2",
  compressor: "10", tank: "60",
  outcome: "freed", time: "45 s", attempts: "1", triggerControl: "4",
  notes: "Soaked overnight.", intent: "submit",
});
