import { sensitivityResult } from "@/lib/explorer";
import { formatSci } from "@/lib/format";
import { explorerIssues, paramText, sensitivitySchema, type SearchParams } from "@/lib/validation/explorer";
import { InputIssues } from "./input-issues";
import { SensitivityForm } from "./sensitivity-form";

const dB = (x: number | null, unit: string) => (x === null ? "no limit" : `${x.toFixed(2)} ${unit}`);

/** Input level to Eb/N0 and back, with the least level a payload needs (server-rendered from the address). */
export function SensitivityPanel({ raw }: { raw: SearchParams }) {
  const parsed = sensitivitySchema.safeParse(raw);
  const values = {
    level: paramText(raw.level) || (paramText(raw.ebn0) ? "" : "-120"),
    ebn0: paramText(raw.ebn0),
    rb: paramText(raw.rb) || "1200",
    nf: paramText(raw.nf) || "0",
    payload: paramText(raw.payload) || "160",
    per: paramText(raw.per) || "0.01",
  };
  const r = parsed.success ? sensitivityResult(parsed.data) : null;
  return (
    <section className="panel space-y-3" aria-label="Sensitivity calculator">
      <h2>Sensitivity and energy per bit</h2>
      <p className="text-sm text-ink-soft">
        Eb/N0 = input level + 173.98 dBm/Hz (thermal noise at 290 K) - 10 log10(information bit rate) - noise figure. The limit is the least energy per bit with
        which any code, modulation and bandwidth sends the payload at the PER.
      </p>
      <SensitivityForm values={values} />
      {!parsed.success ? <InputIssues issues={explorerIssues(parsed.error)} /> : null}
      {r && parsed.success ? (
        <dl className="grid gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr]" aria-label="Sensitivity result">
          <dt className="text-ink-soft">Input level and Eb/N0</dt>
          <dd>
            {dB(r.levelDbm, "dBm")} is Eb/N0 = {dB(r.ebn0Db, "dB")} at {parsed.data.rb.toLocaleString("en-GB")} bit/s and noise figure{" "}
            {dB(parsed.data.nf, "dB")}
          </dd>
          <dt className="text-ink-soft">
            Least level for {parsed.data.payload.toLocaleString("en-GB")} bits at PER {formatSci(parsed.data.per)}
          </dt>
          <dd>
            {dB(r.limitLevelDbm, "dBm")} (Eb/N0 {dB(r.limitEbn0Db, "dB")}; Polyanskiy, Poor, Verdu 2011): a sensitivity below it is impossible
          </dd>
          <dt className="text-ink-soft">Reached by orthogonal signalling from</dt>
          <dd>
            {dB(r.achievableLevelDbm, "dBm")} (Eb/N0 {dB(r.achievableEbn0Db, "dB")})
          </dd>
          <dt className="text-ink-soft">Margin to the limit</dt>
          <dd>{r.limitEbn0Db === null ? "no limit applies" : dB(r.ebn0Db - r.limitEbn0Db, "dB")}</dd>
        </dl>
      ) : null}
      <p className="text-xs text-ink-soft">
        Measured sensitivity depends on test conditions (conducted or radiated, temperature, interference); this judges only the physical limit.
      </p>
    </section>
  );
}
