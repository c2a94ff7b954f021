// The trade's vocabulary, once: closed lists and their words, SI limits, units and their
// conversions, the formatters, the slug pattern and a tool's display name. Forms, the air
// calculator, the feed's field list, filters and pages derive from it; it imports no feature.
export * from "./format";
export * from "./ranges";
export * from "./parse";
export * from "./slug";
export * from "./terms";
export * from "./units";
