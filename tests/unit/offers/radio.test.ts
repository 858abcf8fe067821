import { describe, expect, it } from "vitest";
import { claimSchema, evaluateClaim } from "@/lib/bounds";
import { THERMAL_DBM_PER_HZ } from "@/lib/bounds/thermal";
import { memoDocument, type MemoFacts } from "@/lib/approvals/memo-content";
import { evaluateOffer, sensitivityTerms } from "@/lib/offers";
import {
  curvePointInput,
  formatMarginDb,
  impliedEbn0Db,
  judgement,
  limitEbn0Db,
  meetsSensitivity,
  parseCurveCsv,
  radioClaim,
  sensitivityClaimInput,
  worstPoint,
  vendorCurvePoints,
  type SensitivityTerms,
} from "@/lib/offers/radio";
import { pointScore } from "@/lib/scoring/criteria";
import { SENSITIVITY_CAUTION } from "@/lib/cautions";

const TERMS: SensitivityTerms = { requiredDbm: -130, bitRate: 1200, payloadBits: 160, targetPer: 1e-2, assumedNoiseFigureDb: 6 };

describe("mapping a sensitivity claim to the engine contract", () => {
  it("gives the payload alone as k when the vendor states no code, with the tender's assumed noise figure", () => {
    expect(sensitivityClaimInput(TERMS, { dbm: -141 }, 1e-2)).toEqual({
      channel: { model: "biawgn", sensitivityDbm: -141, bitRate: 1200, assumedNoiseFigureDb: 6 },
      code: { k: 160 },
      target: { metric: "bler", value: 1e-2 },
    });
  });

  it("passes the vendor's noise figure, n, k and modulation when stated, and the input passes the engine's schema", () => {
    const input = sensitivityClaimInput(TERMS, { dbm: -133, noiseFigureDb: 4, modulation: "qpsk", n: 320, k: 160 }, 1e-2);
    expect(input.channel).toMatchObject({ noiseFigureDb: 4, assumedNoiseFigureDb: 6 });
    expect(input.code).toEqual({ n: 320, k: 160, modulation: "qpsk" });
    expect(claimSchema.safeParse(input).success).toBe(true);
  });

  it("maps curve points: dBm with the point's bit rate, Eb/N0 without a noise figure, PER as the packet's BLER, BER as BER", () => {
    const s = { dbm: -140, noiseFigureDb: 2 };
    expect(curvePointInput(TERMS, s, { x: -142, unit: "dBm", metric: "per", value: 1e-1 })).toEqual({
      channel: { model: "biawgn", sensitivityDbm: -142, bitRate: 1200, noiseFigureDb: 2, assumedNoiseFigureDb: 6 },
      code: { k: 160 },
      target: { metric: "bler", value: 1e-1 },
    });
    expect(curvePointInput(TERMS, s, { x: 3, unit: "ebn0Db", metric: "ber", value: 1e-5 })).toEqual({
      channel: { model: "biawgn", ebn0Db: 3 },
      code: { k: 160 },
      target: { metric: "ber", value: 1e-5 },
    });
  });

  it("computes the implied Eb/N0 as S + 173.98 - 10 log10(Rb) - NF (BOUNDS.md section 9; -174 dBm/Hz is common practice)", () => {
    expect(THERMAL_DBM_PER_HZ).toBeCloseTo(-173.975, 3);
    expect(impliedEbn0Db(-130, 1000, 0)).toBeCloseTo(-130 + 173.975 - 30, 3);
    const engine = evaluateClaim(sensitivityClaimInput(TERMS, { dbm: -137.5, noiseFigureDb: 3 }, 1e-2));
    expect(impliedEbn0Db(-137.5, 1200, 3)).toBeCloseTo(engine.implied!.ebn0Db, 9);
  });

  it("reads the buyer's point as sensitivity terms, and none from an Eb/N0 point", () => {
    expect(
      sensitivityTerms({ assumedNoiseFigureDb: 6 }, { label: "A", value: -130, sensitivity: { bitRate: 1200, payloadBits: 160, targetPer: 1e-2 } }),
    ).toEqual(TERMS);
    expect(sensitivityTerms({ assumedNoiseFigureDb: 6 }, { label: "B", value: 3 })).toBeNull();
  });
});

describe("limit, margin and the worst point", () => {
  it("judges against the highest lower bound in Eb/N0 and gives the margin implied minus limit", () => {
    const result = evaluateClaim(sensitivityClaimInput(TERMS, { dbm: -133, n: 320, k: 160 }, 1e-2));
    const limit = limitEbn0Db(result)!;
    expect(limit).toBe(Math.max(result.energy!.converseEbn0Db!, result.thresholds.spherePacking!));
    const j = judgement(result);
    expect(j.marginDb).toBeCloseTo(result.implied!.ebn0Db - limit, 12);
    expect(j.verdict).toBe(result.verdict);
  });

  it("calls a level below the energy limit impossible, with a negative margin", () => {
    const j = judgement(evaluateClaim(sensitivityClaimInput(TERMS, { dbm: -146 }, 1e-2)));
    expect(j.verdict).toBe("impossible");
    expect(j.marginDb!).toBeLessThan(0);
  });

  it("picks the worst verdict first, then the smallest margin; the line when nothing is worse", () => {
    const p = (verdict: "impossible" | "needs-evidence" | "plausible", marginDb: number | null) => ({
      verdict,
      impliedEbn0Db: null,
      limitEbn0Db: null,
      marginDb,
    });
    expect(worstPoint(p("plausible", 3), [p("plausible", 4), p("needs-evidence", 5), p("needs-evidence", 2)])).toMatchObject({ at: 2, marginDb: 2 });
    expect(worstPoint(p("needs-evidence", 1), [p("impossible", -0.5), p("impossible", -1)])).toMatchObject({ at: 1 });
    expect(worstPoint(p("plausible", 1), [p("plausible", 2)])).toMatchObject({ at: "line" });
    expect(worstPoint(p("plausible", 1), [p("plausible", null)])).toMatchObject({ at: "line" });
  });

  it("lets a curve point beyond the limit make the whole claim impossible", () => {
    const s = {
      dbm: -142,
      curve: [
        { x: -145, unit: "dBm" as const, metric: "per" as const, value: 1e-1 },
        { x: -142, unit: "dBm" as const, metric: "per" as const, value: 1e-2 },
      ],
    };
    const line = evaluateClaim(sensitivityClaimInput(TERMS, s, 1e-2));
    const radio = radioClaim(
      TERMS,
      s,
      line,
      s.curve.map((p) => evaluateClaim(curvePointInput(TERMS, s, p))),
    );
    expect(radio.line.verdict).toBe("needs-evidence");
    expect(radio.worst).toMatchObject({ at: 0, verdict: "impossible" });
    expect(radio.worst.marginDb!).toBeLessThan(0);
  });

  it("gives the curve in the charts' shape: each point at its implied Eb/N0 with its verdict, unfinished points left out", () => {
    const s = {
      dbm: -142,
      noiseFigureDb: 2,
      curve: [
        { x: -145, unit: "dBm" as const, metric: "per" as const, value: 1e-1 },
        { x: 3, unit: "ebn0Db" as const, metric: "ber" as const, value: 1e-5 },
      ],
    };
    const radio = radioClaim(TERMS, s, evaluateClaim(sensitivityClaimInput(TERMS, s, 1e-2)), [
      evaluateClaim(curvePointInput(TERMS, s, s.curve[0])),
      { verdict: "needs-evidence" },
    ]);
    expect(vendorCurvePoints(radio)).toEqual([{ ebn0Db: impliedEbn0Db(-145, 1200, 2), value: 0.1, metric: "per", verdict: radio.curve[0].verdict }]);
  });

  it("formats margins with their sign in dB", () => {
    expect(formatMarginDb(1.234)).toBe("+1.23 dB");
    expect(formatMarginDb(-0.5)).toBe("−0.50 dB");
    expect(formatMarginDb(null)).toBe("n/a");
  });

  it("meets the point only at or below the required level and at a PER no worse than the target, and scores 0 otherwise", () => {
    expect(meetsSensitivity({ sensitivityDbm: -131, requiredDbm: -130, targetPer: 1e-2 }, 1e-2).meets).toBe(true);
    expect(meetsSensitivity({ sensitivityDbm: -129, requiredDbm: -130, targetPer: 1e-2 }, 1e-2).note).toMatch(/above the required -130 dBm/);
    expect(meetsSensitivity({ sensitivityDbm: -131, requiredDbm: -130, targetPer: 1e-2 }, 2e-2).meets).toBe(false);
    const claim = {
      id: "c",
      pointIndex: 0,
      metric: "bler" as const,
      value: 1e-2,
      ncgOutputBer: null,
      verdict: "plausible" as const,
      k: null,
      rateGapFraction: null,
      channelMargin: 4,
      channelKind: "dB" as const,
      mark: null,
      evidence: "none" as const,
    };
    const tender = { targetMetric: "ber" as const, targetValue: 1e-9 };
    expect(pointScore({ ...claim, sensitivity: { marginDb: 4, meets: true, note: "", place: "the sensitivity line" } }, tender)).toMatchObject({
      meets: true,
      score: 100,
    });
    expect(pointScore({ ...claim, sensitivity: { marginDb: 4, meets: false, note: "worse", place: "the sensitivity line" } }, tender)).toMatchObject({
      meets: false,
      score: 0,
      note: "worse",
    });
  });
});

describe("an offer on a sensitivity point, evaluated in process", () => {
  const tender = {
    state: "open",
    closesAt: new Date(Date.now() + 86_400_000),
    channelModel: "biawgn" as const,
    currency: "EUR",
    assumedNoiseFigureDb: 6,
    operatingPoints: [{ label: "Valley gateway", value: -130, sensitivity: { bitRate: 1200, payloadBits: 160, targetPer: 1e-2 } }],
  };
  const offer = (sensitivity: Record<string, unknown> | undefined) => ({
    code: { decision: "soft" as const, rate: 0.5 },
    claims: [{ pointIndex: 0, metric: "bler" as const, value: 1e-2, ncgOutputBer: null, sensitivity: sensitivity as never }],
    envelope: { currency: "EUR" },
  });

  it("stores the line's result, the worst verdict and the Eb/N0 the line amounts to as the channel value", () => {
    const out = evaluateOffer(tender, offer({ dbm: -133, noiseFigureDb: 4, curve: [{ x: -1, unit: "ebn0Db", metric: "bler", value: 1e-2 }] }));
    expect(out.ok).toBe(true);
    if (!out.ok) return;
    const [c] = out.claims;
    expect(c.result.verdict).toBe("plausible");
    expect(c.verdict).toBe("impossible");
    expect(c.channelValue).toBeCloseTo(impliedEbn0Db(-133, 1200, 4), 12);
    expect(c.radio!.worst.at).toBe(0);
  });

  it("refuses a sensitivity point without a sensitivity, naming the field", () => {
    const out = evaluateOffer(tender, offer(undefined));
    expect(out.ok).toBe(false);
    if (!out.ok) expect(Object.keys(out.fieldErrors)).toContain("claims.0.sensitivity.dbm");
  });
});

describe("reading a curve from CSV", () => {
  it("reads level_dbm against PER, and Eb/N0 against BER, whatever the header's case and spacing", () => {
    expect(parseCurveCsv("level_dbm,per\n-142,1e-1\n-140,1e-2\n")).toEqual({
      points: [
        { x: -142, unit: "dBm", metric: "per", value: 0.1 },
        { x: -140, unit: "dBm", metric: "per", value: 0.01 },
      ],
      errors: [],
    });
    expect(parseCurveCsv("\uFEFFEbN0 dB,BER\n3,1e-5\n").points).toEqual([{ x: 3, unit: "ebn0Db", metric: "ber", value: 1e-5 }]);
  });

  it("names each bad row and its line, and refuses a file without the x and y columns", () => {
    const report = parseCurveCsv("level_dbm,per\n-142,2\nabc,1e-2\n-140,1e-3\n");
    expect(report.points).toHaveLength(1);
    expect(report.errors).toEqual(["Line 2: per must be a probability strictly between 0 and 1.", "Line 3: level_dbm is not a number."]);
    expect(parseCurveCsv("a,b\n1,2\n").errors[0]).toMatch(/header must name/);
  });
});

describe("the memo's words for a sensitivity claim", () => {
  it("print the line's implied Eb/N0, limit and margin, the curve's margins, the worst point, and the sensitivity caution", () => {
    const s = { dbm: -142, curve: [{ x: -145, unit: "dBm" as const, metric: "per" as const, value: 1e-1 }] };
    const radio = radioClaim(
      TERMS,
      s,
      evaluateClaim(sensitivityClaimInput(TERMS, s, 1e-2)),
      s.curve.map((p) => evaluateClaim(curvePointInput(TERMS, s, p))),
    );
    const at = new Date("2027-03-04T10:15:00.000Z");
    const facts: MemoFacts = {
      identifier: "M",
      draft: true,
      issuedAt: at,
      zone: "UTC",
      buyerOrganisation: "Example Water",
      tender: {
        reference: "R",
        title: "Gateways",
        description: "",
        channelModel: "biawgn",
        operatingPoints: [{ label: "Valley", value: -130, sensitivity: { bitRate: 1200, payloadBits: 160, targetPer: 1e-2 } }],
        targetMetric: "bler",
        targetValue: 1e-2,
        maxFrameBits: null,
        quantity: 1,
        currency: "EUR",
      },
      offers: [
        {
          vendorName: "V",
          moduleName: "M",
          partNumber: "P",
          codeFamily: "polar",
          decision: "soft",
          n: null,
          k: null,
          rate: 0.5,
          claims: [
            {
              pointLabel: "Valley",
              channelValue: radio.line.impliedEbn0Db!,
              metric: "bler",
              value: 1e-2,
              ncgOutputBer: null,
              verdict: "impossible",
              radio,
              mark: null,
              markComment: "",
              runs: [],
            },
          ],
        },
      ],
      scoreSheet: null,
      recommendation: {
        vendorName: "V",
        moduleName: "M",
        value: 1,
        computedValue: 1,
        valueReason: null,
        quantityReason: null,
        currency: "EUR",
        quantity: 1,
        justification: "-",
        preparedBy: "P",
        preparedAt: at,
      },
      approvals: [],
      approvalsNeeded: 1,
      safetyRelevant: false,
      technical: { signatures: [], declarations: [] },
      cautions: "Verdicts judge.",
    };
    const doc = memoDocument(facts);
    const words = doc.offers[0].claims[0].sensitivity!;
    expect(doc.tender.operatingPoints[0]).toMatch(/input level -130 dBm at 1,200 bit\/s, 160-bit payload/);
    expect(words).toContain(
      `implied Eb/N0 ${radio.line.impliedEbn0Db!.toFixed(2)} dB, limit ${radio.line.limitEbn0Db!.toFixed(2)} dB, margin ${formatMarginDb(radio.line.marginDb)}`,
    );
    expect(words).toContain(`Worst: curve point 1 (-145 dBm, PER 0.1), margin ${formatMarginDb(radio.worst.marginDb)}`);
    expect(doc.cautions).toContain(SENSITIVITY_CAUTION);
  });
});

describe("the schemas of sensitivity points and claims", () => {
  it("accept a point in dBm on a BI-AWGN tender and refuse one out of range or on another channel, naming the field", async () => {
    const { tenderFieldsSchema } = await import("@/lib/validation/tender");
    const { offerClaimSchema } = await import("@/lib/validation/offer");
    const point = { label: "Gateway", value: -130, sensitivity: { bitRate: 1200, payloadBits: 160, targetPer: 1e-2 } };
    expect(tenderFieldsSchema.shape.operatingPoints.safeParse([point]).success).toBe(true);
    const bad = tenderFieldsSchema.shape.operatingPoints.safeParse([{ ...point, sensitivity: { ...point.sensitivity, bitRate: -1, payloadBits: 0.5 } }]);
    expect(bad.success).toBe(false);
    expect(bad.error!.issues.map((i) => i.path.join("."))).toEqual(["0.sensitivity.bitRate", "0.sensitivity.payloadBits"]);
    expect(tenderFieldsSchema.shape.assumedNoiseFigureDb.safeParse(-0.1).success).toBe(false);
    const claim = { pointIndex: 0, metric: "ber", value: 1e-2, sensitivity: { dbm: -130 } };
    expect(offerClaimSchema.safeParse(claim).error!.issues[0].path).toEqual(["metric"]);
    expect(offerClaimSchema.safeParse({ ...claim, metric: "bler", sensitivity: { dbm: 30.5 } }).error!.issues[0].path).toEqual(["sensitivity", "dbm"]);
    expect(
      offerClaimSchema.safeParse({ ...claim, metric: "bler", sensitivity: { dbm: -130, curve: [{ x: 60, unit: "ebn0Db", metric: "per", value: 0.1 }] } }).error!
        .issues[0].path,
    ).toEqual(["sensitivity", "curve", 0, "x"]);
  });
});
