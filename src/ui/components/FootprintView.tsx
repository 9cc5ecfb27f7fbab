import { useState } from "preact/hooks";
import type { EstimateOutput } from "../../core/types.ts";
import {
  bandLabelSpots,
  fitView,
  footprintBox,
  LABEL_LINE_PX,
  leaderStart,
  niceLength,
  project,
  rangeRings,
  ringLabelAt,
  ringLabelFits,
  ringPath,
  ringToNorthUp,
  windArrow,
} from "../footprint-view.ts";
import type { BandStyle } from "../palette.ts";
import { compassPoint, formatReach, type UnitSystem } from "../units.ts";

const W = 360;
const H = 360;
const MARGIN = 34;
const ZOOM_STEP = 1.6;

export function FootprintView({
  output,
  styles,
  units,
  placeText,
}: {
  output: EstimateOutput;
  styles: readonly BandStyle[];
  units: UnitSystem;
  placeText: string;
}) {
  const [zoom, setZoom] = useState(1);
  const fp = output.footprint;
  const view = fitView(footprintBox(fp), W, H, MARGIN, zoom);
  const [sx, sy] = project(view, { e: 0, n: 0 });
  const rings = rangeRings(view, units);
  const scale = niceLength(100 * view.mPerPx, units);
  const scalePx = scale.m / view.mPerPx;
  const drawOrder = fp.bands
    .map((b, i) => ({ b, i, style: styles[i] }))
    .sort((a, b) => (b.style?.rank ?? 0) - (a.style?.rank ?? 0));
  const labels = bandLabelSpots(view, fp, 20);
  const nearR = fp.near_zone_m / view.mPerPx;
  const arrow = windArrow(30, 30, fp.heading_deg);
  const longest = Math.max(0, ...output.bands.map((b) => b.reach_m ?? 0));
  const from = (fp.heading_deg + 180) % 360;
  const summary = `Footprint, north up. ${output.bands.length} band(s); longest reach ${formatReach(
    longest > 0 ? longest : null,
    units,
  )} toward ${compassPoint(fp.heading_deg)}. Wind from ${compassPoint(from)}. ${placeText}`;
  return (
    <figure class="footprint">
      <svg
        viewBox={`0 0 ${W} ${H}`}
        class="footprint-svg"
        role="img"
        aria-label={summary}
        data-testid="footprint"
      >
        <defs>
          <marker
            id="arrowhead"
            viewBox="0 0 10 10"
            refX="8"
            refY="5"
            markerWidth="6"
            markerHeight="6"
            orient="auto"
          >
            <path d="M0 0L10 5L0 10Z" class="ink-fill" />
          </marker>
        </defs>
        <rect x="0" y="0" width={W} height={H} class="map-bg" />
        {rings.map((r) => {
          const [lx, ly] = ringLabelAt(sx, sy, r.m / view.mPerPx, fp.heading_deg);
          return (
            <g key={r.m} class="range-ring">
              <circle cx={sx} cy={sy} r={r.m / view.mPerPx} />
              {ringLabelFits(lx, ly, W, H) ? (
                <text x={lx} y={ly} class="ring-label">
                  {r.label}
                </text>
              ) : null}
            </g>
          );
        })}
        {drawOrder.map(({ b, i, style }) => {
          const swept = ringToNorthUp(b.swept, fp.heading_deg);
          const outline = ringToNorthUp(b.outline, fp.heading_deg);
          const hasSwing = fp.wind_swing_deg > 0 && b.swept.length > 0;
          return (
            <g key={b.label} class="band-shape" data-band={i}>
              <path
                d={ringPath(view, hasSwing ? swept : outline)}
                fill={style?.fill ?? "#440154"}
                class="band-fill"
                stroke-width={style?.strokeWidth ?? 2}
                stroke-dasharray={style?.dash || undefined}
              />
              {hasSwing ? <path d={ringPath(view, outline)} class="band-unswept" /> : null}
            </g>
          );
        })}
        <circle cx={sx} cy={sy} r={nearR} class="near-zone" />
        <text x={sx} y={sy - nearR - 5} class="map-label near-label" text-anchor="middle">
          Near zone
        </text>
        <circle cx="30" cy="30" r="24" class="wind-dial" />
        <line
          x1={arrow.x1}
          y1={arrow.y1}
          x2={arrow.x2}
          y2={arrow.y2}
          class="wind-arrow"
          marker-end="url(#arrowhead)"
        />
        <text x="6" y="68" class="map-label" text-anchor="start">
          Wind from {compassPoint(from)}
        </text>
        <circle cx={sx} cy={sy} r="5" class="source" />
        {labels.map((l) =>
          l.moved ? (
            <line
              key={`leader-${l.index}`}
              x1={leaderStart(l)[0]}
              y1={leaderStart(l)[1]}
              x2={l.tipX}
              y2={l.tipY}
              class="leader"
            />
          ) : null,
        )}
        {labels.map((l) => (
          <text key={l.index} x={l.x} y={l.y} class="map-label band-label" text-anchor={l.anchor}>
            {l.lines.map((line, k) => (
              <tspan key={line} x={l.x} dy={k === 0 ? 0 : LABEL_LINE_PX}>
                {line}
              </tspan>
            ))}
          </text>
        ))}
        <g class="north-arrow" transform={`translate(${W - 26} 12)`}>
          <path d="M10 0L18 26L10 21L2 26Z" class="ink-fill" />
          <text x="10" y="42" text-anchor="middle" class="map-label">
            N
          </text>
        </g>
        <g class="scale-bar" transform={`translate(12 ${H - 18})`}>
          <path d={`M0 -6V0H${scalePx.toFixed(1)}V-6`} class="scale-line" />
          <text x={scalePx / 2} y="-9" text-anchor="middle" class="map-label">
            {scale.label}
          </text>
        </g>
      </svg>
      <figcaption>
        <span>
          {fp.wind_swing_deg > 0
            ? `North up. Swept area: band turned through the wind swing ±${fp.wind_swing_deg}°.`
            : "North up. No wind swing: bands along the mean wind only."}
        </span>{" "}
        <span>{placeText}</span>
      </figcaption>
      <div class="map-tools">
        <button type="button" onClick={() => setZoom(zoom * ZOOM_STEP)} disabled={zoom > 200}>
          Zoom in
        </button>
        <button type="button" onClick={() => setZoom(zoom / ZOOM_STEP)} disabled={zoom < 0.2}>
          Zoom out
        </button>
        <button type="button" onClick={() => setZoom(1)} disabled={zoom === 1}>
          Fit
        </button>
      </div>
    </figure>
  );
}
