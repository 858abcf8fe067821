import "server-only";
import { rulesToAST } from "@casl/ability/extra";
import { and, eq, inArray, ne, not, notInArray, or, sql, type Column, type SQL } from "drizzle-orm";
import type { Action, AppAbility, SubjectType } from "@/policies";
import { tenders } from "@/db/schema";

/**
 * How one field a policy condition reads is found in SQL: a column (equality and lists), or a
 * function for fields that are not a plain column (an array held in another table, say).
 */
export type FieldSql = Column | ((operator: string, value: unknown) => SQL);
export type FieldMap = Record<string, FieldSql>;

interface Node {
  operator: string;
  field?: unknown;
  value: unknown;
}

const TRUE = sql`true`;
const FALSE = sql`false`;

function fieldCondition(map: FieldMap, field: string, operator: string, value: unknown): SQL {
  const target = map[field];
  // A condition on a field the list does not know cannot be decided in SQL: refuse loudly rather than allow.
  if (!target) throw new Error(`No SQL for the policy field "${field}"; add it to the list's field map.`);
  if (typeof target === "function") return target(operator, value);
  switch (operator) {
    case "eq":
      return eq(target, value);
    case "ne":
      return ne(target, value);
    case "in":
      return (value as unknown[]).length ? inArray(target, value as unknown[]) : FALSE;
    case "nin":
      return (value as unknown[]).length ? notInArray(target, value as unknown[]) : TRUE;
    default:
      throw new Error(`The policy operator "${operator}" on "${field}" has no SQL form here.`);
  }
}

function toSql(node: Node, map: FieldMap): SQL {
  if (typeof node.field === "string") return fieldCondition(map, node.field, node.operator, node.value);
  const parts = (node.value as Node[]).map((n) => toSql(n, map));
  switch (node.operator) {
    case "and":
      return parts.length ? and(...parts)! : TRUE;
    case "or":
      return parts.length ? or(...parts)! : FALSE;
    case "not":
      return not(parts.length === 1 ? parts[0] : and(...parts)!);
    default:
      throw new Error(`The policy operator "${node.operator}" has no SQL form here.`);
  }
}

/**
 * The records of one subject this ability may act on, as a WHERE clause: the same CASL rules the
 * record-by-record checks use (through CASL's own rulesToAST), so a list can be filtered, counted
 * and paged by the database. Nothing allowed gives `false`; everything allowed gives `true`.
 */
export function accessibleWhere(ability: AppAbility, action: Action, subject: SubjectType, fields: FieldMap): SQL {
  const ast = rulesToAST(ability, action, subject) as Node | null;
  return ast === null ? FALSE : toSql(ast, fields);
}

/** `%text%` for ILIKE, with the pattern characters of the text itself taken literally. */
export const containing = (text: string) => `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

/** A field the policies read that is computed from columns: compared as the expression's value. */
export function computedField(expression: SQL): (operator: string, value: unknown) => SQL {
  return (operator, value) => {
    const list = value as unknown[];
    switch (operator) {
      case "eq":
        return sql`${expression} = ${value}`;
      case "ne":
        return sql`${expression} <> ${value}`;
      case "in":
        return list.length
          ? sql`${expression} in (${sql.join(
              list.map((v) => sql`${v}`),
              sql`, `,
            )})`
          : FALSE;
      case "nin":
        return list.length
          ? sql`${expression} not in (${sql.join(
              list.map((v) => sql`${v}`),
              sql`, `,
            )})`
          : TRUE;
      default:
        throw new Error(`The policy operator "${operator}" has no SQL form on a computed field.`);
    }
  };
}

/** The tender state the policies read on records (policies recordTenderState): a tender cancelled before closing reads "cancelled-sealed". */
export const recordTenderStateSql = sql<string>`(case when ${tenders.state} = 'cancelled' and ${tenders.cancelledSealed} then 'cancelled-sealed' else ${tenders.state} end)`;
