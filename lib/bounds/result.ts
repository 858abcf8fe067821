// The result contract shared by the CLI, POST /api/v1/evaluate and the stored verdicts.
import { z } from "zod";
import { CHANNEL_MODELS, VERDICTS } from "./vocabulary";

const finding = z.object({
  code: z.string(),
  severity: z.enum(["violation", "gap", "support", "info"]),
  message: z.string(),
  source: z.string(),
});
const bound = z.object({ log10Bler: z.number(), bler: z.number() }).nullable();

export const claimResultSchema = z.object({
  verdict: z.enum(VERDICTS),
  findings: z.array(finding),
  /** k/n; null for a payload-only claim (no block length, no bandwidth limit). */
  rate: z.number().nullable(),
  capacity: z.number().nullable(),
  converse: bound,
  achievable: bound,
  normal: z.object({ rate: z.number(), log10Bler: z.number(), bler: z.number() }).nullable(),
  /** Shannon's 1959 bound at the claim's n, k and Eb/N0 (every BI-AWGN claim with n and k). */
  spherePacking: z.object({ log10Bler: z.number() }).nullable(),
  thresholds: z.object({
    capacity: z.number(),
    shannon: z.number(),
    converse: z.number().nullable(),
    achievable: z.number().nullable(),
    normal: z.number().nullable(),
    /** Least Eb/N0 (dB, whatever the unit) at which the 1959 bound allows the claimed BLER. */
    spherePacking: z.number().nullable(),
    unit: z.enum(["p", "e", "ebn0Db", "esn0Db"]),
  }),
  /** Least Eb/N0 (dB) to send k bits at the claimed BLER: converse and orthogonal achievability (PPV 2011). */
  energy: z.object({ converseEbn0Db: z.number().nullable(), achievableEbn0Db: z.number().nullable() }).nullable(),
  /** The Eb/N0 (dB) the claim amounts to, judged at the vendor's noise figure or 0 dB (every BI-AWGN claim). */
  implied: z.object({ ebn0Db: z.number() }).nullable(),
  margins: z.object({
    rateGapBits: z.number().nullable(),
    rateGapFraction: z.number().nullable(),
    channelKind: z.enum(["ratio", "dB"]),
    channel: z.object({
      capacity: z.number().nullable(),
      converse: z.number().nullable(),
      achievable: z.number().nullable(),
      normal: z.number().nullable(),
    }),
  }),
  channel: z.object({
    model: z.enum(CHANNEL_MODELS),
    p: z.number().optional(),
    e: z.number().optional(),
    esn0Db: z.number().optional(),
    ebn0Db: z.number().optional(),
    ncgDb: z.number().optional(),
    sensitivityDbm: z.number().optional(),
    bitRate: z.number().optional(),
    noiseFigureDb: z.number().optional(),
    assumedNoiseFigureDb: z.number().optional(),
  }),
  n: z.number().nullable(),
  k: z.number().nullable(),
  target: z.object({ metric: z.enum(["bler", "ber"]), value: z.number(), log10: z.number() }),
  dispersion: z.number().nullable(),
  gallager: z.object({ exponent: z.number(), log10Bler: z.number().nullable() }).nullable(),
  engineVersion: z.string(),
});

export type ClaimResult = z.infer<typeof claimResultSchema>;
