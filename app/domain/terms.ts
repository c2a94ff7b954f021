// The trade's closed lists: each code once, in the order forms offer it, with the words pages show.
// The database's CHECK constraints (migrations/) hold the same codes; the feed publishes them as enums.

/** Words for each code; a lookup by any string (a stored column, a URL value) may miss. */
export type Labels<K extends string> = Readonly<Record<K, string>> & Readonly<Record<string, string>>;

export const VEHICLE_CLASSES = [
  "passenger_car",
  "light_truck",
  "heavy_truck",
  "bus",
  "trailer",
  "agricultural",
  "construction",
] as const;
export type VehicleClass = (typeof VEHICLE_CLASSES)[number];
export const VEHICLE_LABELS: Labels<VehicleClass> = {
  passenger_car: "Passenger car",
  light_truck: "Light truck",
  heavy_truck: "Heavy truck",
  bus: "Bus",
  trailer: "Trailer",
  agricultural: "Agricultural",
  construction: "Construction equipment",
};

export const CORROSION_LEVELS = ["none", "light", "moderate", "heavy", "severe"] as const;
export type CorrosionLevel = (typeof CORROSION_LEVELS)[number];

/** How the pressure at the tool inlet was obtained. */
export const INLET_SOURCES = ["measured_at_inlet", "read_at_regulator", "estimated"] as const;
export type InletSource = (typeof INLET_SOURCES)[number];
/** As a record shows it, after the figure: "620 kPa (measured at the tool inlet)". */
export const INLET_SOURCE_LABELS: Labels<InletSource> = {
  measured_at_inlet: "measured at the tool inlet",
  read_at_regulator: "read at the regulator",
  estimated: "estimated",
};
/** As the report form asks it of the reporter. */
export const INLET_SOURCE_CHOICES: Labels<InletSource> = {
  measured_at_inlet: "Measured at the tool inlet while it ran",
  read_at_regulator: "Read at the regulator",
  estimated: "Estimated",
};

export const OUTCOMES = ["freed", "freed_with_help", "not_freed"] as const;
export type Outcome = (typeof OUTCOMES)[number];
/** As a record shows it. */
export const OUTCOME_LABELS: Labels<Outcome> = {
  freed: "Freed",
  freed_with_help: "Freed with help",
  not_freed: "Not freed",
};
/** As the report form asks it of the reporter. */
export const OUTCOME_CHOICES: Labels<Outcome> = {
  freed: "Freed it",
  freed_with_help: "Freed with help (heat, another tool)",
  not_freed: "Did not free it",
};

/** Quick-coupler profiles (plug and socket). The air module holds each one's flow figures. */
export const COUPLER_PROFILES = ["industrial_m", "automotive_t", "high_flow_v", "iso_6150_b", "other"] as const;
export type CouplerProfile = (typeof COUPLER_PROFILES)[number];
export const COUPLER_LABELS: Labels<CouplerProfile> = {
  industrial_m: "Industrial (M-style)",
  automotive_t: "Automotive (T-style)",
  high_flow_v: "High-flow (V-style)",
  iso_6150_b: "ISO 6150 B",
  other: "Other / unknown",
};
/** The profile assumed where a form does not ask (the commonest in North American shops). */
export const DEFAULT_COUPLER_PROFILE: CouplerProfile = "industrial_m";

/** What a tool takes: a hammer's bit shank (inches) or a wrench's square drive. */
export const FITTINGS = [
  "shank-0.401",
  "shank-0.498",
  "drive-1/4",
  "drive-3/8",
  "drive-1/2",
  "drive-3/4",
  "drive-1",
] as const;
export type Fitting = (typeof FITTINGS)[number];
export const FITTING_LABELS: Labels<Fitting> = {
  "shank-0.401": "0.401 in shank",
  "shank-0.498": "0.498 in shank",
  "drive-1/4": "1/4 in drive",
  "drive-3/8": "3/8 in drive",
  "drive-1/2": "1/2 in drive",
  "drive-3/4": "3/4 in drive",
  "drive-1": "1 in drive",
};
/** The air hammer bit shanks: a shopper's bits fit one of them. */
export const SHANKS = ["shank-0.401", "shank-0.498"] as const satisfies readonly Fitting[];
export type Shank = (typeof SHANKS)[number];

export const isFitting = (value: unknown): value is Fitting => (FITTINGS as readonly unknown[]).includes(value);

/**
 * The common air hose bores, as sold: in inches (the fraction the trade writes) and the same bore
 * in millimetres, rounded as metric hose is labelled.
 */
export const HOSE_BORES = [
  { in: 0.25, inText: "1/4", mmText: "6.35" },
  { in: 0.3125, inText: "5/16", mmText: "7.9" },
  { in: 0.375, inText: "3/8", mmText: "9.5" },
  { in: 0.5, inText: "1/2", mmText: "12.7" },
] as const;

/** Where a catalogue figure came from (tool_models' *_source columns; running_air_source the same). */
export const SPEC_SOURCES = ["maker_sheet", "measured", "estimated"] as const;
export type SpecSource = (typeof SPEC_SOURCES)[number];
export const SPEC_SOURCE_LABELS: Labels<SpecSource> = {
  maker_sheet: "maker's sheet",
  measured: "measured",
  estimated: "estimate",
};

/** What holds the bit in a hammer (or the socket on a drive) as the tool comes. */
export const BIT_RETAINERS = ["beehive_spring", "quick_change", "friction_ring", "detent_pin", "none"] as const;
export type BitRetainer = (typeof BIT_RETAINERS)[number];
export const BIT_RETAINER_LABELS: Labels<BitRetainer> = {
  beehive_spring: "Beehive spring retainer",
  quick_change: "Quick-change retainer",
  friction_ring: "Friction ring",
  detent_pin: "Detent pin",
  none: "No retainer",
};

/**
 * The parts of ISO 28927 (vibration test codes for hand-held portable power tools) a declared a_hv
 * names; titles abridged (from memory; part 10 as in REFERENCES.md). Noise is declared under ISO 15744.
 */
export const ISO_28927_PARTS: Readonly<Record<number, string>> = {
  1: "angle and vertical grinders",
  2: "wrenches, nutrunners and screwdrivers",
  3: "polishers and sanders",
  4: "straight grinders",
  5: "drills and impact drills",
  6: "rammers",
  7: "nibblers and shears",
  8: "reciprocating saws and files",
  9: "scaling hammers and needle scalers",
  10: "percussive drills, hammers and breakers",
  11: "stone hammers",
  12: "die grinders",
  13: "fastener driving tools",
};
/** "ISO 28927-10 (percussive drills, hammers and breakers)". */
export const iso28927Label = (part: number) =>
  `ISO 28927-${part}${ISO_28927_PARTS[part] ? ` (${ISO_28927_PARTS[part]})` : ""}`;

/** Evidence files a report carries. */
export const EVIDENCE_KINDS = ["video", "photo"] as const;
export type EvidenceKind = (typeof EVIDENCE_KINDS)[number];
export const EVIDENCE_KIND_LABELS: Labels<EvidenceKind> = { video: "Video", photo: "Photo" };

/** A tool as people name it: the maker's name and the model code ("Brackwater BH-150"). */
export const toolName = (maker: string, modelCode: string) => `${maker} ${modelCode}`;
