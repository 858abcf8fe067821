import { z, type ZodType } from "zod";
import { claimResultSchema, claimSchema } from "@/lib/bounds/schema";
import { approvalBandSchema, decisionSchema, fingerprintSchema } from "@/lib/validation/approvals";
import { recommendationSchema, withdrawalSchema } from "@/lib/validation/comparison";
import { offerSchema } from "@/lib/validation/offer";
import { createOrganisationSchema, createUserSchema, peopleQuerySchema, updateUserSchema } from "@/lib/validation/people";
import {
  claimQueueSchema,
  declarationSchema,
  closeThreadSchema,
  evidenceImportSchema,
  evidenceRunSchema,
  markSchema,
  messageSchema,
  signoffSchema,
  threadSchema,
} from "@/lib/validation/review";
import { ledgerStepSchema } from "@/lib/validation/ledger";
import { cancelTenderSchema, tenderInputSchema, tenderListQuerySchema, tenderPatchSchema } from "@/lib/validation/tender";
import { addendumSchema, ledgerPageSchema, objectionAnswerSchema, objectionSchema } from "@/lib/validation/notices";

export type Method = "get" | "post" | "put" | "patch" | "delete";

export interface ApiRoute {
  method: Method;
  /** OpenAPI path, parameters in braces. */
  path: string;
  tag: string;
  summary: string;
  body?: ZodType;
  /** A multipart/form-data upload, with the fields it takes. */
  upload?: Record<string, string>;
  query?: ZodType;
  response?: ZodType;
  /** What a success returns when it is not JSON. */
  produces?: "application/pdf" | "application/octet-stream";
  /** Public routes need no session. */
  public?: boolean;
  created?: boolean;
}

const evaluateBody = z.union([claimSchema, z.array(claimSchema).min(1).max(1000)]);
const evaluateResponse = z.union([claimResultSchema, z.array(claimResultSchema)]);
const threadsQuery = z.object({ tenderId: z.string().optional() });

/** Every route of the REST API. A test checks this list against the route files, both ways. */
export const API_ROUTES: ApiRoute[] = [
  { method: "get", path: "/me", tag: "People", summary: "The signed-in person, roles and packed abilities" },
  {
    method: "get",
    path: "/users",
    tag: "People",
    summary: "One page of people (admin), filtered by name or e-mail, organisation, role and status",
    query: peopleQuerySchema,
  },
  { method: "post", path: "/users", tag: "People", summary: "Create an account (admin)", body: createUserSchema, created: true },
  { method: "patch", path: "/users/{id}", tag: "People", summary: "Change roles, active flag or approval limit (admin)", body: updateUserSchema },
  { method: "get", path: "/organisations", tag: "People", summary: "Organisations the viewer may read" },
  { method: "post", path: "/organisations", tag: "People", summary: "Add a vendor organisation (admin)", body: createOrganisationSchema, created: true },

  {
    method: "post",
    path: "/evaluate",
    tag: "Bounds",
    summary: "Judge one claim, or up to 1,000, against the bounds",
    body: evaluateBody,
    response: evaluateResponse,
  },

  {
    method: "get",
    path: "/tenders",
    tag: "Tenders",
    summary: "One page of the tenders the viewer may read, newest first, filtered by state and by text in the reference or title",
    query: tenderListQuerySchema,
  },
  { method: "post", path: "/tenders", tag: "Tenders", summary: "Create a draft tender (buyer)", body: tenderInputSchema, created: true },
  { method: "get", path: "/tenders/{id}", tag: "Tenders", summary: "One tender" },
  { method: "patch", path: "/tenders/{id}", tag: "Tenders", summary: "Edit a draft tender (buyer)", body: tenderPatchSchema },
  { method: "post", path: "/tenders/{id}/open", tag: "Tenders", summary: "Open a draft for offers; locks requirements and weights" },
  { method: "post", path: "/tenders/{id}/cancel", tag: "Tenders", summary: "Cancel a tender before its award, with a reason", body: cancelTenderSchema },
  { method: "get", path: "/tenders/{id}/objections", tag: "Notices", summary: "The standstill period and the objections the viewer may read" },
  {
    method: "post",
    path: "/tenders/{id}/objections",
    tag: "Notices",
    summary: "Object in writing to an award during the standstill period (vendor)",
    body: objectionSchema,
    created: true,
  },
  {
    method: "post",
    path: "/objections/{id}/answer",
    tag: "Notices",
    summary: "Answer a vendor's objection in writing, once (buyer)",
    body: objectionAnswerSchema,
  },
  { method: "get", path: "/tenders/{id}/addenda", tag: "Notices", summary: "Addenda of a tender, with who acknowledged them" },
  {
    method: "post",
    path: "/tenders/{id}/addenda",
    tag: "Notices",
    summary: "Publish an addendum to every invited vendor, without the asker's name (buyer, declared engineer)",
    body: addendumSchema,
    created: true,
  },
  {
    method: "get",
    path: "/tenders/{id}/ledger",
    tag: "Ledger",
    summary: "A page of the tender's ledger as sentences, details the viewer may not read masked",
    query: ledgerPageSchema,
  },
  {
    method: "post",
    path: "/addenda/{id}/acknowledge",
    tag: "Notices",
    summary: "Acknowledge an addendum for the vendor's organisation (needed before submitting)",
  },

  { method: "get", path: "/tenders/{id}/offers", tag: "Offers", summary: "Current offers the viewer may read, sealed fields removed" },
  {
    method: "post",
    path: "/tenders/{id}/offers",
    tag: "Offers",
    summary: "Submit or resubmit an offer (vendor); verdicts computed",
    body: offerSchema,
    created: true,
  },
  { method: "get", path: "/offers/{id}", tag: "Offers", summary: "One offer version with its history (the vendor's own)" },
  { method: "post", path: "/offers/{id}/withdraw", tag: "Offers", summary: "Withdraw an offer before closing (vendor)" },
  {
    method: "post",
    path: "/offers/{id}/documents",
    tag: "Documents",
    summary: "Upload a PDF datasheet or test report, at most 20 MB",
    upload: { file: "the PDF", kind: "datasheet or test-report" },
    created: true,
  },
  { method: "get", path: "/documents/{id}", tag: "Documents", summary: "Download a document", produces: "application/octet-stream" },

  { method: "get", path: "/tenders/{id}/declaration", tag: "Review", summary: "The viewer's conflict-of-interest declaration on a tender" },
  {
    method: "post",
    path: "/tenders/{id}/declaration",
    tag: "Review",
    summary: "Declare no conflict, or conflicts with named vendors",
    body: declarationSchema,
    created: true,
  },
  {
    method: "get",
    path: "/claims",
    tag: "Review",
    summary: "One page of the Review bench queue, with the vendors it holds for the vendor filter",
    query: claimQueueSchema,
  },
  { method: "get", path: "/claims/{id}", tag: "Review", summary: "One claim with findings, marks and documents" },
  { method: "get", path: "/claims/{id}/marks", tag: "Review", summary: "Marks of a claim" },
  { method: "post", path: "/claims/{id}/marks", tag: "Review", summary: "Mark a claim (engineer)", body: markSchema, created: true },
  { method: "get", path: "/claims/{id}/evidence", tag: "Evidence", summary: "Lab runs of a claim with Clopper-Pearson bounds" },
  { method: "post", path: "/claims/{id}/evidence", tag: "Evidence", summary: "Record a lab run (engineer)", body: evidenceRunSchema, created: true },
  {
    method: "post",
    path: "/claims/{id}/evidence/import",
    tag: "Evidence",
    summary: "Import lab runs from CSV; per-row report",
    body: evidenceImportSchema,
    upload: { file: "a CSV file" },
    created: true,
  },
  { method: "get", path: "/claims/{id}/threads", tag: "Clarifications", summary: "Clarification threads of a claim" },
  { method: "post", path: "/claims/{id}/threads", tag: "Clarifications", summary: "Ask the vendor a clarification", body: threadSchema, created: true },
  { method: "get", path: "/threads", tag: "Clarifications", summary: "Threads the viewer takes part in", query: threadsQuery },
  { method: "get", path: "/threads/{id}/messages", tag: "Clarifications", summary: "Messages of a thread" },
  { method: "post", path: "/threads/{id}/messages", tag: "Clarifications", summary: "Answer in a thread", body: messageSchema, created: true },
  { method: "post", path: "/threads/{id}/close", tag: "Clarifications", summary: "Close a question with a reason (engineer)", body: closeThreadSchema },
  { method: "get", path: "/tenders/{id}/signoff", tag: "Review", summary: "How far the technical evaluation is" },
  { method: "post", path: "/tenders/{id}/signoff", tag: "Review", summary: "Sign the technical evaluation (engineer)", body: signoffSchema, created: true },

  { method: "post", path: "/tenders/{id}/envelopes", tag: "Commercial", summary: "Open the sealed envelopes (buyer, after technical sign-off)" },
  { method: "get", path: "/tenders/{id}/comparison", tag: "Commercial", summary: "The comparison grid with score sheets (buyer, approver)" },
  { method: "get", path: "/tenders/{id}/recommendation", tag: "Commercial", summary: "The current recommendation" },
  { method: "post", path: "/tenders/{id}/recommendation", tag: "Commercial", summary: "Recommend an award (buyer)", body: recommendationSchema, created: true },
  {
    method: "post",
    path: "/tenders/{id}/recommendation/withdraw",
    tag: "Commercial",
    summary: "Withdraw the recommendation awaiting approval (buyer)",
    body: withdrawalSchema,
  },

  { method: "get", path: "/approval-bands", tag: "Approvals", summary: "Approval value bands" },
  { method: "post", path: "/approval-bands", tag: "Approvals", summary: "Add a value band (admin)", body: approvalBandSchema, created: true },
  { method: "put", path: "/approval-bands/{id}", tag: "Approvals", summary: "Change a value band (admin)", body: approvalBandSchema },
  { method: "delete", path: "/approval-bands/{id}", tag: "Approvals", summary: "Remove a value band (admin)" },
  { method: "get", path: "/tenders/{id}/approvals", tag: "Approvals", summary: "Approvals of the current recommendation" },
  {
    method: "post",
    path: "/tenders/{id}/approvals",
    tag: "Approvals",
    summary: "Approve or return the recommendation (approver)",
    body: decisionSchema,
    created: true,
  },
  { method: "get", path: "/tenders/{id}/memo", tag: "Memo", summary: "Download the signed award memo", produces: "application/pdf" },
  { method: "get", path: "/tenders/{id}/memo/preview", tag: "Memo", summary: "Preview the award memo before approval", produces: "application/pdf" },
  {
    method: "post",
    path: "/memo-check",
    tag: "Memo",
    summary: "Check a memo file or fingerprint",
    body: fingerprintSchema,
    upload: { file: "the memo PDF" },
    public: true,
  },
  { method: "get", path: "/ledger/verify", tag: "Ledger", summary: "Verify the entries added since the last check, and the signed checkpoints" },
  { method: "get", path: "/ledger/checks", tag: "Ledger", summary: "The most recent full checks of the ledger (admin)" },
  { method: "post", path: "/ledger/checks", tag: "Ledger", summary: "Start a full check of the whole ledger (admin)", created: true },
  { method: "get", path: "/ledger/checks/{id}", tag: "Ledger", summary: "Progress and result of a full check (admin)" },
  { method: "post", path: "/ledger/checks/{id}", tag: "Ledger", summary: "Verify the next batch of a full check (admin)", query: ledgerStepSchema },
  {
    method: "post",
    path: "/backups",
    tag: "Operations",
    summary: "Back up the embedded database and object store while the server runs (admin)",
    created: true,
  },
];
