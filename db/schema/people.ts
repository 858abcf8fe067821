import { boolean, index, numeric, pgTable, primaryKey, text, timestamp } from "drizzle-orm/pg-core";
import { ORGANISATION_KINDS, ROLES, type OrganisationKind, type Role } from "@/policies/vocabulary";
import { id, createdAt, oneOf, updatedAt } from "./columns";

export { ORGANISATION_KINDS, type OrganisationKind };

export const organisations = pgTable(
  "organisations",
  {
    id: id(),
    name: text("name").notNull().unique(),
    kind: text("kind").$type<OrganisationKind>().notNull(),
    country: text("country"),
    createdAt: createdAt(),
  },
  (t) => [oneOf("organisations_kind_check", t.kind, ORGANISATION_KINDS)],
);

// The four tables below follow better-auth's core schema (user, session, account, verification);
// its schema CLI needs Node 22, so they are written here by hand.
export const users = pgTable(
  "user",
  {
    id: id(),
    name: text("name").notNull(),
    email: text("email").notNull().unique(),
    emailVerified: boolean("email_verified").notNull().default(false),
    image: text("image"),
    organisationId: text("organisation_id")
      .notNull()
      .references(() => organisations.id),
    active: boolean("active").notNull().default(true),
    // The largest award value this person may approve, in the tender currency (approvers only).
    approvalLimit: numeric("approval_limit", { precision: 16, scale: 2, mode: "number" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("user_organisation_idx").on(t.organisationId)],
);

export const sessions = pgTable(
  "session",
  {
    id: id(),
    expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
    token: text("token").notNull().unique(),
    ipAddress: text("ip_address"),
    userAgent: text("user_agent"),
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    createdAt: createdAt(),
    updatedAt: updatedAt(),
  },
  (t) => [index("session_user_idx").on(t.userId)],
);

export const accounts = pgTable("account", {
  id: id(),
  accountId: text("account_id").notNull(),
  providerId: text("provider_id").notNull(),
  userId: text("user_id")
    .notNull()
    .references(() => users.id, { onDelete: "cascade" }),
  accessToken: text("access_token"),
  refreshToken: text("refresh_token"),
  idToken: text("id_token"),
  accessTokenExpiresAt: timestamp("access_token_expires_at", { withTimezone: true }),
  refreshTokenExpiresAt: timestamp("refresh_token_expires_at", { withTimezone: true }),
  scope: text("scope"),
  password: text("password"),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export const verifications = pgTable("verification", {
  id: id(),
  identifier: text("identifier").notNull(),
  value: text("value").notNull(),
  expiresAt: timestamp("expires_at", { withTimezone: true }).notNull(),
  createdAt: createdAt(),
  updatedAt: updatedAt(),
});

export { ROLES as ROLE_NAMES } from "@/policies/vocabulary";
export type RoleName = Role;

export const userRoles = pgTable(
  "user_roles",
  {
    userId: text("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    role: text("role").$type<RoleName>().notNull(),
    grantedAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.role] }), oneOf("user_roles_role_check", t.role, ROLES)],
);
