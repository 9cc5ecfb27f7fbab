import {
  concentrationRange,
  curvePieces,
  decadeTicks,
  type LogScale,
  logPos,
  tickLabel,
} from "../chart-scale.ts";
import type { BandStyle } from "../palette.ts";
import type { Profile } from "../profile.ts";
import { M_PER_FT, type UnitSystem } from "../units.ts";

const W = 360;
const H = 260;
const PAD = { left: 52, right: 10, top: 12, bottom: 40 };

export function CentrelineChart({
  profile,
  styles,
  units,
}: {
  profile: Profile;
  styles: readonly BandStyle[];
  units: UnitSystem;
}) {
  const { xs, curves } = profile;
  const range = concentrationRange(
    curves.map((c) => c.limit_mg_m3),
    curves.flatMap((c) => c.values_mg_m3),
  );
  const xMin = xs[0] ?? 1;
  const xMax = xs[xs.length - 1] ?? 10;
  const sx: LogScale = { min: xMin, max: xMax, from: PAD.left, to: W - PAD.right };
  const sy: LogScale = { min: range.min, max: range.max, from: H - PAD.bottom, to: PAD.top };
  // Axis ticks in the display unit: metres, or feet for US customary.
  const xUnit = units === "metric" ? 1 : M_PER_FT;
  const xTicks = decadeTicks(xMin / xUnit, xMax / xUnit);
  const yTicks = decadeTicks(range.min, range.max);
  return (
    <figure class="chart">
      <svg
        viewBox={`0 0 ${W} ${H}`}
        class="chart-svg"
        role="img"
        aria-label="Concentration on the plume centreline against downwind distance, both on log scales, with each limit as a horizontal line."
      >
        <rect
          x={PAD.left}
          y={PAD.top}
          width={W - PAD.left - PAD.right}
          height={H - PAD.top - PAD.bottom}
          class="plot-bg"
        />
        {xTicks.map((t) => {
          const x = logPos(sx, t * xUnit) ?? 0;
          return (
            <g key={`x${t}`}>
              <line x1={x} x2={x} y1={PAD.top} y2={H - PAD.bottom} class="grid" />
              <text x={x} y={H - PAD.bottom + 14} text-anchor="middle" class="tick">
                {tickLabel(t)}
              </text>
            </g>
          );
        })}
        {yTicks.map((t) => {
          const y = logPos(sy, t) ?? 0;
          return (
            <g key={`y${t}`}>
              <line x1={PAD.left} x2={W - PAD.right} y1={y} y2={y} class="grid" />
              <text x={PAD.left - 4} y={y + 4} text-anchor="end" class="tick">
                {tickLabel(t)}
              </text>
            </g>
          );
        })}
        <text x={(PAD.left + W - PAD.right) / 2} y={H - 6} text-anchor="middle" class="axis-title">
          Downwind distance ({units === "metric" ? "m" : "ft"})
        </text>
        <text
          transform={`translate(12 ${(PAD.top + H - PAD.bottom) / 2}) rotate(-90)`}
          text-anchor="middle"
          class="axis-title"
        >
          Concentration (mg/m³)
        </text>
        {curves.map((c, i) => {
          const style = styles[i];
          const y = logPos(sy, c.limit_mg_m3);
          return (
            <g key={c.label} class="curve">
              {y !== null ? (
                <>
                  <line
                    x1={PAD.left}
                    x2={W - PAD.right}
                    y1={y}
                    y2={y}
                    class="limit-line"
                    stroke={style?.fill}
                    stroke-dasharray="6 3"
                  />
                  <text x={W - PAD.right - 2} y={y - 3} text-anchor="end" class="limit-label">
                    {c.label}
                  </text>
                </>
              ) : null}
              {curvePieces(xs, c.values_mg_m3, sx, sy).map((pts) => (
                <polyline
                  key={pts.slice(0, 16)}
                  points={pts}
                  class="curve-line"
                  stroke-width={style?.strokeWidth ?? 2}
                  stroke-dasharray={style?.dash || undefined}
                />
              ))}
            </g>
          );
        })}
      </svg>
      <figcaption>
        Each curve is the centreline concentration averaged over its limit's time; it is drawn with
        the same outline pattern as that limit's band. Where a curve is above its limit's line, the
        limit is exceeded.
      </figcaption>
    </figure>
  );
}
