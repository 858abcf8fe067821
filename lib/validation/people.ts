import { z } from "zod";
import { ROLES as ROLE_NAMES } from "@/policies/vocabulary";
import { optionalChoice, optionalFilter, pagingSchema } from "./paging";
import { typedDecimal } from "./numbers";

/** An approval limit in the buying currency; empty (null) is no limit. */
const approvalLimit = typedDecimal(
  z.number({ error: "Enter the approval limit as a number, or leave it empty." }).nonnegative("Must be zero or more.").max(1e12).nullable(),
);

export const roleListSchema = z
  .array(z.enum(ROLE_NAMES))
  .min(1, "Choose at least one role.")
  .refine((roles) => !roles.includes("vendor") || roles.length === 1, "A vendor user holds the vendor role only.");

export const createUserSchema = z.object({
  name: z.string().trim().min(2, "Enter the person's name.").max(120),
  email: z.email("Enter an e-mail address.").max(254),
  password: z.string().min(8, "At least 8 characters.").max(200),
  organisationId: z.string().min(1, "Choose an organisation."),
  roles: roleListSchema,
  approvalLimit: approvalLimit.optional(),
});
export type CreateUserInput = z.infer<typeof createUserSchema>;

export const setRolesSchema = z.object({ roles: roleListSchema });
export const setActiveSchema = z.object({ active: z.boolean() });
export const setApprovalLimitSchema = z.object({
  approvalLimit: approvalLimit,
});
export const updateUserSchema = z
  .object({
    roles: roleListSchema.optional(),
    active: z.boolean().optional(),
    approvalLimit: approvalLimit.optional(),
  })
  .refine((v) => Object.keys(v).length > 0, "Send roles, active or approvalLimit.");
export type UpdateUserInput = z.infer<typeof updateUserSchema>;

export const createOrganisationSchema = z.object({
  name: z.string().trim().min(2, "Enter the organisation's name.").max(160),
  country: z.string().trim().length(2, "Two-letter country code.").toUpperCase().optional(),
});

/** The People list's filters, as they appear in the URL. */
export const peopleFiltersSchema = z.object({
  q: optionalFilter(),
  organisationId: optionalFilter(),
  role: optionalChoice(ROLE_NAMES, "role"),
  status: optionalChoice(["active", "deactivated"], "status"),
});
export type PeopleFilters = z.infer<typeof peopleFiltersSchema>;
/** GET /api/v1/users: the filters and a page. */
export const peopleQuerySchema = peopleFiltersSchema.extend(pagingSchema.shape);
