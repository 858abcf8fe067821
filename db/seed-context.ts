import type { RoleName } from "./schema";

// The demo's cast and what the parts of the seed hand on to each other (db/seed.ts and db/seed-*.ts).
// Everything below is invented for the demonstration: no real company, person or figure.
export const DEMO_PASSWORD = "ratecourt-demo";

export const DEMO_ORGANISATIONS = {
  buyer: { name: "Tarnwell Water Authority", kind: "buyer", country: "GB" },
  kestrelink: { name: "Kestrelink Radio", kind: "vendor", country: "NL" },
  marram: { name: "Marram Telemetry", kind: "vendor", country: "DK" },
  oxbow: { name: "Oxbow Wireless", kind: "vendor", country: "IE" },
  quillfield: { name: "Quillfield RF", kind: "vendor", country: "DE" },
} as const;
export type OrgKey = keyof typeof DEMO_ORGANISATIONS;

export const DEMO_USERS: {
  key: string;
  name: string;
  email: string;
  org: OrgKey;
  roles: RoleName[];
  approvalLimit?: number;
}[] = [
  { key: "admin", name: "Dana Whitlock", email: "admin@tarnwell.example", org: "buyer", roles: ["admin"] },
  { key: "buyer", name: "Ines Calloway", email: "buyer@tarnwell.example", org: "buyer", roles: ["buyer"] },
  { key: "engineer", name: "Ravi Okonjo", email: "engineer@tarnwell.example", org: "buyer", roles: ["engineer"] },
  {
    key: "approver",
    name: "Helen Strand",
    email: "approver@tarnwell.example",
    org: "buyer",
    roles: ["approver"],
    approvalLimit: 250_000,
  },
  {
    key: "director",
    name: "Tomas Veld",
    email: "director@tarnwell.example",
    org: "buyer",
    roles: ["approver", "engineer"],
    approvalLimit: 2_000_000,
  },
  { key: "kestrelink", name: "Pieter Aalders", email: "sales@kestrelink.example", org: "kestrelink", roles: ["vendor"] },
  { key: "marram", name: "Signe Holm", email: "offers@marram.example", org: "marram", roles: ["vendor"] },
  { key: "oxbow", name: "Aoife Brennan", email: "bids@oxbow.example", org: "oxbow", roles: ["vendor"] },
  { key: "quillfield", name: "Jonas Reuter", email: "tenders@quillfield.example", org: "quillfield", roles: ["vendor"] },
];

/** What later parts of the seed need to know about what came before. */
export interface DemoContext {
  orgIds: Record<OrgKey, string>;
  userIds: Record<string, string>;
  /** gauges: in technical evaluation with four offers; weirs: open for offers; rain: a draft; gateways: open, stated in sensitivity terms, three offers. */
  tenderIds: { gauges: string; weirs: string; rain: string; gateways: string };
  now: number;
}
