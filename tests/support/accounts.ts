/** The demo accounts the tests sign in as, by short name (no imports, so any test runner can use it). */
export const DEMO_ACCOUNTS = {
  admin: "admin@tarnwell.example",
  buyer: "buyer@tarnwell.example",
  engineer: "engineer@tarnwell.example",
  approver: "approver@tarnwell.example",
  director: "director@tarnwell.example",
  kestrelink: "sales@kestrelink.example",
  marram: "offers@marram.example",
  oxbow: "bids@oxbow.example",
  quillfield: "tenders@quillfield.example",
} as const;
export type DemoAccount = keyof typeof DEMO_ACCOUNTS;
