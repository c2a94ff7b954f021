// Invented shops and people for the demo. Every e-mail is under the reserved .test domain (RFC 2606).
import type { Trade } from "../db/schema";

export interface ShopSeed {
  name: string;
  city: string;
  region: string;
  trade: Trade;
  /** Demo only: the shop's usual air supply. */
  air: { regulatorPsi: number; compressorLps: number; tankL: number; hoseIdIn: number; hoseFt: number };
}

export const shops: ShopSeed[] = [
  {
    name: "Cinderlane Auto Repair",
    city: "Brimwick",
    region: "East Vale",
    trade: "automotive",
    air: { regulatorPsi: 95, compressorLps: 7, tankL: 230, hoseIdIn: 0.25, hoseFt: 35 },
  },
  {
    name: "Northgate Fleet Services",
    city: "Fennport",
    region: "Coastal",
    trade: "fleet",
    air: { regulatorPsi: 110, compressorLps: 25, tankL: 450, hoseIdIn: 0.375, hoseFt: 50 },
  },
  {
    name: "Ridgeback Heavy Repair",
    city: "Caddon Ridge",
    region: "High Plains",
    trade: "heavy_equipment",
    air: { regulatorPsi: 115, compressorLps: 40, tankL: 900, hoseIdIn: 0.5, hoseFt: 50 },
  },
  {
    name: "Tamarind Truck & Trailer",
    city: "Ostermoor",
    region: "High Plains",
    trade: "fleet",
    air: { regulatorPsi: 105, compressorLps: 18, tankL: 450, hoseIdIn: 0.375, hoseFt: 75 },
  },
  {
    name: "Willowmere Garage",
    city: "Vellan Falls",
    region: "East Vale",
    trade: "automotive",
    air: { regulatorPsi: 90, compressorLps: 5, tankL: 110, hoseIdIn: 0.25, hoseFt: 25 },
  },
  {
    name: "Ironbark Equipment Service",
    city: "Corranby",
    region: "North Reach",
    trade: "heavy_equipment",
    air: { regulatorPsi: 120, compressorLps: 35, tankL: 900, hoseIdIn: 0.5, hoseFt: 75 },
  },
  {
    name: "Saltmarsh Transit Depot",
    city: "Thistlebay",
    region: "Coastal",
    trade: "fleet",
    air: { regulatorPsi: 100, compressorLps: 20, tankL: 450, hoseIdIn: 0.375, hoseFt: 35 },
  },
  {
    name: "Foxhollow Motor Works",
    city: "Wexhollow",
    region: "North Reach",
    trade: "automotive",
    air: { regulatorPsi: 96, compressorLps: 9, tankL: 230, hoseIdIn: 0.3125, hoseFt: 50 },
  },
];

const reporterHandles = [
  "rustbelt-ana",
  "torque-omar",
  "bay3-lenka",
  "knuckle-dev",
  "greasecap-ty",
  "slipjoint-rosa",
  "hub-nut-kai",
  "undercar-mia",
  "shank-jonas",
  "chassis-ife",
  "lugbreaker-sam",
  "brakeline-wen",
  "tierod-pavel",
  "fleetbay-noor",
  "kingpin-gus",
  "axlebay-rhea",
  "bushing-tomas",
  "coupler-ade",
  "drivetrain-lu",
  "steer-axle-bo",
  "pickle-fork-iz",
  "scaler-dana",
  "ratchet-yuki",
  "manifold-ola",
  "regulator-teo",
  "hosebarb-kim",
  "frame-rail-eli",
  "springpin-nia",
  "trailerbay-mo",
  "tracklink-oz",
  "u-bolt-vera",
  "idler-arm-jem",
  "strut-bay-ravi",
  "crossmember-al",
  "wheelend-fay",
  "diffbay-hugo",
  "pitbay-sol",
  "airline-bea",
  "nightshift-ned",
  "apprentice-pip",
];

export interface PersonSeed {
  handle: string;
  email: string;
  shopIndex: number;
  roles: ("moderator" | "admin")[];
  pressureUnit: "psi" | "bar" | "kPa";
  lengthUnit: "in" | "mm";
}

const DOMAIN = "demo.bayproof.test";

export const people: PersonSeed[] = [
  ...reporterHandles.map((handle, i): PersonSeed => ({
    handle,
    // The first reporter has the well-known demo address.
    email: i === 0 ? `reporter@${DOMAIN}` : `${handle}@${DOMAIN}`,
    shopIndex: i % shops.length,
    roles: [],
    pressureUnit: i % 5 === 4 ? "bar" : "psi",
    lengthUnit: i % 5 === 4 ? "mm" : "in",
  })),
  {
    handle: "mod-harriet",
    email: `moderator@${DOMAIN}`,
    shopIndex: 1,
    roles: ["moderator"],
    pressureUnit: "psi",
    lengthUnit: "in",
  },
  {
    handle: "mod-quentin",
    email: `moderator2@${DOMAIN}`,
    shopIndex: 2,
    roles: ["moderator"],
    pressureUnit: "bar",
    lengthUnit: "mm",
  },
  {
    handle: "mod-odalys",
    email: `moderator3@${DOMAIN}`,
    shopIndex: 5,
    roles: ["moderator"],
    pressureUnit: "psi",
    lengthUnit: "in",
  },
  {
    handle: "admin-bertil",
    email: `admin@${DOMAIN}`,
    shopIndex: 0,
    roles: ["admin", "moderator"],
    pressureUnit: "psi",
    lengthUnit: "in",
  },
];

/** The local fake OpenID provider's id and the subjects it signs the demo people in as. */
export const DEMO_OIDC_PROVIDER = "local";
export const demoSubject = (handle: string) => `demo-${handle}`;
