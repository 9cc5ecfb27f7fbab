import type { EstimateOutput, ScenarioLimit, Warning } from "../../core/types.ts";
import { bandFigures, nearZoneWords, splitWarnings, stabilityWords } from "../figures.ts";
import type { BandStyle } from "../palette.ts";
import type { UnitSystem } from "../units.ts";

function WarningList({ warnings, title }: { warnings: readonly Warning[]; title: string }) {
  if (warnings.length === 0) return null;
  return (
    <div class="model-limits">
      <p class="model-limits-title">{title}</p>
      <ul>
        {warnings.map((w) => (
          <li key={`${w.code}-${w.limit ?? ""}-${w.message}`}>{w.message}</li>
        ))}
      </ul>
    </div>
  );
}

function Swatch({ style }: { style: BandStyle }) {
  return (
    <svg class="swatch" width="28" height="18" viewBox="0 0 28 18" aria-hidden="true">
      <rect
        x="2"
        y="2"
        width="24"
        height="14"
        fill={style.fill}
        stroke="currentColor"
        stroke-width={style.strokeWidth}
        stroke-dasharray={style.dash || undefined}
      />
    </svg>
  );
}

export function Results({
  output,
  units,
  ongoing,
  styles,
  limits,
}: {
  limits: readonly ScenarioLimit[];
  output: EstimateOutput;
  units: UnitSystem;
  ongoing: boolean;
  styles: readonly BandStyle[];
}) {
  const { general, byBand } = splitWarnings(
    output.warnings,
    output.bands.map((b) => b.label),
  );
  return (
    <div class="results">
      <p class="stability-used">{stabilityWords(output.stability_used, output.stability_reason)}</p>
      <p class="near-zone-note">{nearZoneWords(output.footprint.near_zone_m, units)}</p>
      <WarningList warnings={general} title="Model limits for this estimate" />
      <ol class="bands">
        {output.bands.map((b, i) => {
          const style = styles[i];
          return (
            <li class="band" key={b.label} data-testid={`band-${i}`}>
              <h3 class="band-name">
                {style ? <Swatch style={style} /> : null}
                {b.label}
              </h3>
              <dl class="figures">
                {bandFigures(b, units, ongoing, limits[i]).map((f) => (
                  <div class="figure" key={f.key}>
                    <dt>{f.label}</dt>
                    <dd data-testid={f.key === "reach" ? `band-reach-${i}` : undefined}>
                      {f.value}
                    </dd>
                  </div>
                ))}
              </dl>
              <WarningList warnings={byBand[i] ?? []} title={`Model limits for ${b.label}`} />
            </li>
          );
        })}
      </ol>
    </div>
  );
}
