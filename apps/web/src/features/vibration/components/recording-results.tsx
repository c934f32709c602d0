import type { CutResults, FrfResults, Machine, ProposedMode, RecordingDetail, RecordingPeakResult, SpindleFreeResults, TapResults, UnitSystem } from "@ringdown/contracts";
import { CheckCircle2, Plus, TriangleAlert } from "lucide-react";
import { Link } from "react-router-dom";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Card, CardBody, CardHeader } from "@/components/ui/card";
import { Notice } from "@/components/ui/page-header";
import { Quantity } from "@/components/ui/quantity";
import { MeasureValue } from "@/components/ui/measure";
import { measures } from "@/components/ui/units";
import { toSearch } from "@/lib/active-shop";
import { formatNumber, formatQuantity } from "@/lib/format";
import { SpectrumChart } from "./charts/lazy";

const hz = (f: number) => formatQuantity(f, "Hz", { significantDigits: f >= 1000 ? 5 : 4 });
const rpmText = (n: number) => formatQuantity(n, "rpm", { fractionDigits: 0 });

const peakKindLabels: Record<RecordingPeakResult["kind"], string> = {
  "tooth-passing": "Tooth passing",
  spindle: "Spindle (runout)",
  "chatter-candidate": "Possible chatter",
  unclassified: "Peak",
};

function Notes({ notes }: { notes: string[] }) {
  if (notes.length === 0) return null;
  return (
    <ul className="list-disc space-y-0.5 pl-5 text-sm text-muted">
      {notes.map((n) => (
        <li key={n}>{n}</li>
      ))}
    </ul>
  );
}

function Figure({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <div className="rounded-md border border-rule bg-paper/60 px-3 py-2">
      <dt className="text-xs text-muted">{label}</dt>
      <dd className="text-base">{children}</dd>
    </div>
  );
}

function SpectrumLegend({ guides, peaks, chatter }: { guides: { spindle: boolean; tooth: boolean; mark?: string }; peaks: boolean; chatter: boolean }) {
  return (
    <ul className="flex flex-wrap gap-x-5 gap-y-1 text-xs text-muted" aria-label="Legend">
      <li className="inline-flex items-center gap-1.5">
        <svg width="18" height="8" aria-hidden>
          <line x1="0" x2="18" y1="4" y2="4" stroke="#1F6F8B" strokeWidth="1.5" />
        </svg>
        Measured amplitude
      </li>
      {guides.tooth && (
        <li className="inline-flex items-center gap-1.5">
          <svg width="8" height="14" aria-hidden>
            <line x1="4" x2="4" y1="0" y2="14" stroke="rgba(51, 64, 122, 0.6)" />
          </svg>
          Tooth-passing harmonics
        </li>
      )}
      {guides.spindle && (
        <li className="inline-flex items-center gap-1.5">
          <svg width="8" height="14" aria-hidden>
            <line x1="4" x2="4" y1="0" y2="14" stroke="rgba(107, 111, 118, 0.6)" strokeDasharray="2 3" />
          </svg>
          Spindle-rotation harmonics
        </li>
      )}
      {guides.mark && (
        <li className="inline-flex items-center gap-1.5">
          <svg width="8" height="14" aria-hidden>
            <line x1="4" x2="4" y1="0" y2="14" stroke="#1F6F8B" strokeDasharray="5 2" />
          </svg>
          {guides.mark}
        </li>
      )}
      {peaks && (
        <li className="inline-flex items-center gap-1.5">
          <svg width="12" height="10" aria-hidden>
            <path d="M1.5 1.5 H10.5 L6 9 Z" fill="#22252A" />
          </svg>
          Detected peak
        </li>
      )}
      {chatter && (
        <li className="inline-flex items-center gap-1.5">
          <svg width="12" height="12" aria-hidden>
            <circle cx="6" cy="6" r="4.5" fill="#B83A2E" />
          </svg>
          Possible chatter
        </li>
      )}
    </ul>
  );
}

function PeaksTable({ peaks }: { peaks: RecordingPeakResult[] }) {
  if (peaks.length === 0) return <p className="text-sm text-muted">No peak stands clearly above the noise floor.</p>;
  return (
    <div className="overflow-auto rounded-md border border-rule">
      <table className="w-full text-sm">
        <caption className="sr-only">Peaks of the spectrum, strongest first</caption>
        <thead className="bg-paper text-xs text-muted">
          <tr>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">
              Frequency
            </th>
            <th scope="col" className="px-3 py-1.5 text-left font-medium">
              What it is
            </th>
            <th scope="col" className="px-3 py-1.5 text-right font-medium">
              Above the floor
            </th>
          </tr>
        </thead>
        <tbody>
          {peaks.map((p) => (
            <tr key={`${p.frequencyHz}-${p.kind}`} className="border-t border-rule/70">
              <td className="px-3 py-1.5 text-right tabular">{hz(p.frequencyHz)}</td>
              <td className="px-3 py-1.5">
                {p.kind === "chatter-candidate" ? <Badge tone="limit">{peakKindLabels[p.kind]}</Badge> : peakKindLabels[p.kind]}
                {p.harmonic !== null && <span className="text-muted"> · harmonic {p.harmonic}</span>}
              </td>
              <td className="px-3 py-1.5 text-right tabular">×{formatNumber(p.aboveFloor, { significantDigits: 3 })}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function CutResultsView({ results, machine }: { results: CutResults; machine: Machine }) {
  const chatter = results.chatterCandidates;
  return (
    <>
      <Card>
        <CardHeader title="Spectrum" description={`Welch average of ${results.segments} segments, ${formatQuantity(results.spectrum.binWidthHz, "Hz", { significantDigits: 3 })} resolution.`} />
        <CardBody className="flex flex-col gap-3">
          <SpectrumChart
            spectrum={results.spectrum}
            peaks={results.peaks}
            spindleHarmonicsHz={results.spindleHarmonicsHz}
            toothPassingHarmonicsHz={results.toothPassingHarmonicsHz}
            magnitudeLabel="Amplitude (log)"
          />
          <SpectrumLegend
            guides={{ spindle: results.spindleHarmonicsHz.length > 0, tooth: results.toothPassingHarmonicsHz.length > 0 }}
            peaks={results.peaks.length > 0}
            chatter={chatter.length > 0}
          />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="What the recording says" />
        <CardBody className="flex flex-col gap-4">
          {results.toothPassingFrequencyHz === null ? (
            <p className="text-sm text-muted">Without the spindle speed and flute count the peaks cannot be told apart: upload again with both to classify them.</p>
          ) : chatter.length > 0 ? (
            <div role="status" className="flex items-start gap-2 rounded-md border border-limit/40 bg-limit/5 px-3 py-2 text-sm text-ink">
              <TriangleAlert className="mt-0.5 size-4 shrink-0 text-limit" aria-hidden />
              <p>
                {chatter.length === 1 ? "One peak is" : `${chatter.length} peaks are`} not a multiple of the spindle rotation: possible chatter at{" "}
                {chatter.map((c) => hz(c.frequencyHz)).join(", ")}. Chatter rings near a mode of the machine or the cutter; the speeds below put the
                tooth-passing frequency in step with it.
              </p>
            </div>
          ) : (
            <div role="status" className="flex items-start gap-2 rounded-md border border-ok/30 bg-ok/5 px-3 py-2 text-sm text-ink">
              <CheckCircle2 className="mt-0.5 size-4 shrink-0 text-ok" aria-hidden />
              <p>Every clear peak is a harmonic of the spindle rotation or of tooth passing: no sign of chatter in this recording.</p>
            </div>
          )}
          <dl className="grid gap-3 sm:grid-cols-3">
            <Figure label="Tooth-passing frequency">{results.toothPassingFrequencyHz === null ? "—" : <Quantity value={results.toothPassingFrequencyHz} unit="Hz" significantDigits={4} />}</Figure>
            <Figure label="Speed measured from it">{results.measuredRpm === null ? "—" : <Quantity value={results.measuredRpm} unit="rpm" fractionDigits={0} />}</Figure>
            <Figure label="Recording">
              <Quantity value={results.durationS} unit="s" significantDigits={3} /> at <Quantity value={results.sampleRateHz} unit="Hz" fractionDigits={0} />
            </Figure>
          </dl>
          <section aria-labelledby="suggested-speeds" className="flex flex-col gap-2">
            <h3 id="suggested-speeds" className="text-sm font-semibold text-ink">
              Suggested stable speeds
            </h3>
            {results.suggestedSpeeds.length === 0 ? (
              <p className="text-sm text-muted">
                {chatter.length === 0 ? "No chatter to move away from: no speed change suggested." : "No speed within the spindle's range puts tooth passing in step with the chatter."}
              </p>
            ) : (
              <>
                <p className="text-xs text-muted">
                  Each puts the tooth-passing frequency at the chatter frequency divided by a whole number, the stable side of a lobe. Try them in a test cut, nearest
                  first. Starting points only: stay within the cutter maker's and the spindle's limits.
                </p>
                <ol className="flex flex-col divide-y divide-rule/70 rounded-md border border-rule" aria-label="Suggested stable speeds">
                  {results.suggestedSpeeds.map((s) => (
                    <li key={`${s.rpm}-${s.divisor}`} className="flex flex-wrap items-center justify-between gap-2 px-3 py-2 text-sm">
                      <span>
                        <Quantity value={s.rpm} unit="rpm" fractionDigits={0} className="text-base" />
                        <span className="text-muted">
                          {" "}
                          · tooth passing = {hz(s.chatterFrequencyHz)} ÷ {s.divisor}
                        </span>
                      </span>
                      <Link
                        to={`/planner${toSearch({ machineId: machine.id, rpm: Math.round(s.rpm) })}`}
                        className="text-sm font-medium text-brand underline-offset-2 hover:underline"
                      >
                        Plan at {rpmText(s.rpm)}
                      </Link>
                    </li>
                  ))}
                </ol>
              </>
            )}
          </section>
          <section aria-labelledby="peaks-heading" className="flex flex-col gap-2">
            <h3 id="peaks-heading" className="text-sm font-semibold text-ink">
              Peaks
            </h3>
            <PeaksTable peaks={results.peaks} />
          </section>
          <Notes notes={results.notes} />
        </CardBody>
      </Card>
    </>
  );
}

function ModeOffer({
  proposed,
  accepted,
  mayEdit,
  pending,
  onAccept,
  system,
}: {
  proposed: ProposedMode;
  accepted: boolean;
  mayEdit: boolean;
  pending: boolean;
  onAccept: () => void;
  system: UnitSystem;
}) {
  const stiffnessSource = {
    modal_fit: "fitted to the response",
    dial_indicator_readings: "from the dial-indicator readings in this direction",
    machine_value: "the machine's stiffness in this direction",
  } as const;
  return (
    <section aria-labelledby="proposed-mode" className="flex flex-col gap-3 rounded-md border border-measured/30 bg-measured/5 px-4 py-3">
      <h3 id="proposed-mode" className="text-sm font-semibold text-ink">
        Mode found in {proposed.direction.toUpperCase()}
      </h3>
      <dl className="grid gap-3 sm:grid-cols-3">
        <Figure label="Natural frequency">
          <Quantity value={proposed.frequencyHz} unit="Hz" significantDigits={4} />
        </Figure>
        <Figure label="Damping ratio ζ">
          <span className="tabular">{formatNumber(proposed.dampingRatio, { significantDigits: 3 })}</span>
        </Figure>
        <Figure label="Modal stiffness">
          <MeasureValue value={proposed.stiffnessNPerMm} measure={measures.stiffness} system={system} />
        </Figure>
      </dl>
      {proposed.stiffnessSource && <p className="text-xs text-muted">Stiffness {stiffnessSource[proposed.stiffnessSource]}.</p>}
      {accepted ? (
        <p className="inline-flex items-center gap-2 text-sm text-ok">
          <CheckCircle2 className="size-4" aria-hidden /> Added to this machine's modes.
        </p>
      ) : proposed.stiffnessNPerMm === null ? (
        <p className="text-sm text-[#8a5a12]">
          No stiffness is known in {proposed.direction.toUpperCase()} yet: add a dial-indicator reading in that direction, then add the mode.
        </p>
      ) : mayEdit ? (
        <div>
          <Button onClick={onAccept} pending={pending}>
            <Plus className="size-4" aria-hidden /> Add to this machine's modes
          </Button>
        </div>
      ) : (
        <p className="text-sm text-muted">A tooling manager or the owner can add this mode to the machine.</p>
      )}
    </section>
  );
}

function TapResultsView({ results, recording, mayEdit, accept, system }: { results: TapResults; recording: RecordingDetail; mayEdit: boolean; accept: AcceptProps; system: UnitSystem }) {
  const r = results.ringDown;
  return (
    <>
      <Card>
        <CardHeader title="Spectrum of the ring-down" />
        <CardBody className="flex flex-col gap-3">
          <SpectrumChart spectrum={results.spectrum} peaks={[]} marks={[{ frequencyHz: r.frequencyHz, label: "Ring-down frequency" }]} magnitudeLabel="Amplitude (log)" />
          <SpectrumLegend guides={{ spindle: false, tooth: false, mark: "Ring-down frequency" }} peaks={false} chatter={false} />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Tap test" description="The spectrum peak gives the frequency; the decay of the ring (logarithmic decrement) gives the damping." />
        <CardBody className="flex flex-col gap-4">
          <dl className="grid gap-3 sm:grid-cols-3">
            <Figure label="Ringing frequency">
              <Quantity value={r.frequencyHz} unit="Hz" significantDigits={4} />
            </Figure>
            <Figure label="Logarithmic decrement δ">
              <span className="tabular">{formatNumber(r.logDecrement, { significantDigits: 3 })}</span>
            </Figure>
            <Figure label="Cycles used · fit">
              <span className="tabular">
                {r.cyclesUsed} · {formatNumber(r.fitQuality, { significantDigits: 3 })}
              </span>
            </Figure>
          </dl>
          <ModeOffer proposed={results.proposedMode} accepted={recording.acceptedModeId !== null} mayEdit={mayEdit} system={system} {...accept} />
          <Notes notes={results.notes} />
        </CardBody>
      </Card>
    </>
  );
}

function FrfResultsView({ results, recording, mayEdit, accept, system }: { results: FrfResults; recording: RecordingDetail; mayEdit: boolean; accept: AcceptProps; system: UnitSystem }) {
  const f = results.fittedMode;
  return (
    <>
      <Card>
        <CardHeader title="Frequency response" description="Magnitude of the receptance |G|, with the fitted mode marked." />
        <CardBody className="flex flex-col gap-3">
          <SpectrumChart spectrum={results.spectrum} peaks={[]} marks={[{ frequencyHz: f.frequencyHz, label: "Fitted mode" }]} magnitudeLabel="|G| [mm/N] (log)" magnitudeUnit="mm/N" />
          <SpectrumLegend guides={{ spindle: false, tooth: false, mark: "Fitted mode" }} peaks={false} chatter={false} />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Fitted mode" description="Peak picking with the half-power bandwidth: ζ = (f₂ − f₁) / 2fₙ, k from the peak height." />
        <CardBody className="flex flex-col gap-4">
          <dl className="grid gap-3 sm:grid-cols-3">
            <Figure label="Peak">
              <Quantity value={f.peakFrequencyHz} unit="Hz" significantDigits={4} />
            </Figure>
            <Figure label="Half-power points">
              <Quantity value={f.lowerHalfPowerHz} unit="Hz" significantDigits={4} /> – <Quantity value={f.upperHalfPowerHz} unit="Hz" significantDigits={4} />
            </Figure>
            <Figure label="Modal stiffness (fit)">
              <MeasureValue value={f.stiffnessNPerMm} measure={measures.stiffness} system={system} />
            </Figure>
          </dl>
          <ModeOffer proposed={results.proposedMode} accepted={recording.acceptedModeId !== null} mayEdit={mayEdit} system={system} {...accept} />
          <Notes notes={results.notes} />
        </CardBody>
      </Card>
    </>
  );
}

function SpindleFreeResultsView({ results, recording, mayEdit, dial }: { results: SpindleFreeResults; recording: RecordingDetail; mayEdit: boolean; dial: DialProps }) {
  return (
    <>
      <Card>
        <CardHeader title="Spectrum" />
        <CardBody className="flex flex-col gap-3">
          <SpectrumChart spectrum={results.spectrum} peaks={results.peaks} marks={[{ frequencyHz: results.rotationFrequencyHz, label: "Rotation frequency" }]} magnitudeLabel="Amplitude (log)" />
          <SpectrumLegend guides={{ spindle: false, tooth: false, mark: "Rotation frequency" }} peaks={results.peaks.length > 0} chatter={false} />
        </CardBody>
      </Card>
      <Card>
        <CardHeader title="Real spindle speed" description="Rotation frequency × 60, measured with the spindle running free." />
        <CardBody className="flex flex-col gap-4">
          <dl className="grid gap-3 sm:grid-cols-3">
            <Figure label="Rotation frequency">
              <Quantity value={results.rotationFrequencyHz} unit="Hz" significantDigits={5} />
            </Figure>
            <Figure label="Measured speed">
              <Quantity value={results.measuredRpm} unit="rpm" fractionDigits={0} />
            </Figure>
            <Figure label={results.dialSetting ? `Dial setting ${results.dialSetting} says` : "Nominal speed"}>
              {results.nominalRpm === null ? "—" : <Quantity value={results.nominalRpm} unit="rpm" fractionDigits={0} />}
              {results.differencePct !== null && (
                <span className="ml-1 text-sm text-muted tabular">
                  ({results.differencePct >= 0 ? "+" : "−"}
                  {formatNumber(Math.abs(results.differencePct), { significantDigits: 3 })} %)
                </span>
              )}
            </Figure>
          </dl>
          {results.dialSetting &&
            (recording.dialRpmApplied ? (
              <p className="inline-flex items-center gap-2 text-sm text-ok">
                <CheckCircle2 className="size-4" aria-hidden /> Dial setting {results.dialSetting} now runs at {rpmText(results.measuredRpm)} on this machine.
              </p>
            ) : mayEdit ? (
              <div>
                <Button onClick={dial.onApply} pending={dial.pending}>
                  Use {rpmText(results.measuredRpm)} as the real speed of dial setting {results.dialSetting}
                </Button>
              </div>
            ) : (
              <p className="text-sm text-muted">A tooling manager or the owner can set dial setting {results.dialSetting} to this speed.</p>
            ))}
          <PeaksTable peaks={results.peaks} />
          <Notes notes={results.notes} />
        </CardBody>
      </Card>
    </>
  );
}

interface AcceptProps {
  pending: boolean;
  onAccept: () => void;
}
interface DialProps {
  pending: boolean;
  onApply: () => void;
}

/** The results of an analysed recording, by kind, with the one-click actions they offer. */
export function RecordingResults({
  recording,
  machine,
  mayEdit,
  system,
  accept,
  dial,
  acceptError,
}: {
  recording: RecordingDetail;
  machine: Machine;
  mayEdit: boolean;
  system: UnitSystem;
  accept: AcceptProps;
  dial: DialProps;
  acceptError: string | null;
}) {
  const results = recording.results;
  if (!results) return <p className="text-sm text-muted">The analysis finished without results.</p>;
  return (
    <div className="flex flex-col gap-5">
      {acceptError && <Notice tone="limit">{acceptError}</Notice>}
      {results.kind === "cut" && <CutResultsView results={results} machine={machine} />}
      {results.kind === "tap" && <TapResultsView results={results} recording={recording} mayEdit={mayEdit} accept={accept} system={system} />}
      {results.kind === "frf" && <FrfResultsView results={results} recording={recording} mayEdit={mayEdit} accept={accept} system={system} />}
      {results.kind === "spindle_free" && <SpindleFreeResultsView results={results} recording={recording} mayEdit={mayEdit} dial={dial} />}
    </div>
  );
}
