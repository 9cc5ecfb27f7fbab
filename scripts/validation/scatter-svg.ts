/**
 * Log–log scatter plot of predicted against observed concentrations, as a standalone SVG string:
 * the 1:1 line (solid), the factor-of-two lines Cp = 2·Co and Cp = Co/2 (dashed), decade ticks,
 * labelled axes and a legend. One series per scheme, each with its own marker shape as well as
 * colour (viridis endpoints), so the plot reads in greyscale.
 */

export interface ScatterSeries {
  label: string;
  /** [observed, predicted], both > 0, same unit. */
  points: [number, number][];
}

export interface ScatterOptions {
  title: string;
  xLabel: string;
  yLabel: string;
  /** Small print under the title (e.g. the dataset citation). */
  note?: string;
}

const W = 640;
const H = 640;
const M = { left: 80, right: 24, top: 64, bottom: 72 };
const COLOURS = ["#440154", "#21918c", "#fde725"];

const esc = (s: string): string =>
  s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");

const fmt = (v: number): string => (Math.round(v * 100) / 100).toString();

function tickLabel(p: number): string {
  const v = 10 ** p;
  return p >= 0 ? v.toFixed(0) : v.toFixed(-p);
}

/** Render the scatter; values that are not finite and positive are skipped. */
export function scatterSvg(series: ScatterSeries[], opt: ScatterOptions): string {
  const all = series.flatMap((s) => s.points.flat()).filter((v) => Number.isFinite(v) && v > 0);
  const lo = Math.floor(Math.log10(all.length ? Math.min(...all) : 0.1));
  const hi = Math.ceil(Math.log10(all.length ? Math.max(...all) : 10));
  const lo10 = lo === hi ? lo - 1 : lo;
  const pw = W - M.left - M.right;
  const ph = H - M.top - M.bottom;
  const sx = (v: number) => M.left + ((Math.log10(v) - lo10) / (hi - lo10)) * pw;
  const sy = (v: number) => M.top + ph - ((Math.log10(v) - lo10) / (hi - lo10)) * ph;
  const vmin = 10 ** lo10;
  const vmax = 10 ** hi;
  const out: string[] = [];
  out.push(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}" viewBox="0 0 ${W} ${H}" font-family="system-ui, sans-serif" font-size="12">`,
    `<rect width="${W}" height="${H}" fill="#ffffff"/>`,
    `<text x="${W / 2}" y="24" text-anchor="middle" font-size="15" font-weight="600">${esc(opt.title)}</text>`,
  );
  if (opt.note) {
    out.push(
      `<text x="${W / 2}" y="42" text-anchor="middle" font-size="11" fill="#444">${esc(opt.note)}</text>`,
    );
  }
  out.push(
    `<defs><clipPath id="plot"><rect x="${M.left}" y="${M.top}" width="${pw}" height="${ph}"/></clipPath></defs>`,
  );
  // Grid and ticks at each decade.
  for (let p = lo10; p <= hi; p++) {
    const v = 10 ** p;
    const x = fmt(sx(v));
    const y = fmt(sy(v));
    out.push(
      `<line x1="${x}" y1="${M.top}" x2="${x}" y2="${M.top + ph}" stroke="#e3e3e3"/>`,
      `<line x1="${M.left}" y1="${y}" x2="${M.left + pw}" y2="${y}" stroke="#e3e3e3"/>`,
      `<text x="${x}" y="${M.top + ph + 18}" text-anchor="middle">${tickLabel(p)}</text>`,
      `<text x="${M.left - 8}" y="${fmt(sy(v) + 4)}" text-anchor="end">${tickLabel(p)}</text>`,
    );
  }
  out.push(
    `<rect x="${M.left}" y="${M.top}" width="${pw}" height="${ph}" fill="none" stroke="#333"/>`,
  );
  // 1:1 and factor-of-two lines.
  const line = (k: number, dash: string) =>
    `<line clip-path="url(#plot)" x1="${fmt(sx(vmin))}" y1="${fmt(sy(vmin * k))}" x2="${fmt(sx(vmax))}" y2="${fmt(sy(vmax * k))}" stroke="#333" stroke-width="1.2"${dash}/>`;
  out.push(line(1, ""), line(2, ' stroke-dasharray="6 4"'), line(0.5, ' stroke-dasharray="6 4"'));
  // Points.
  series.forEach((s, i) => {
    const c = COLOURS[i % COLOURS.length];
    out.push(`<g clip-path="url(#plot)" fill="none" stroke="${c}" stroke-width="1.3">`);
    for (const [o, p] of s.points) {
      if (!(o > 0 && p > 0 && Number.isFinite(o) && Number.isFinite(p))) continue;
      const x = fmt(sx(o));
      const y = fmt(sy(p));
      out.push(
        i % 2 === 0
          ? `<circle cx="${x}" cy="${y}" r="3.2"/>`
          : `<rect x="${fmt(sx(o) - 3)}" y="${fmt(sy(p) - 3)}" width="6" height="6"/>`,
      );
    }
    out.push("</g>");
  });
  // Axis labels.
  out.push(
    `<text x="${M.left + pw / 2}" y="${H - 24}" text-anchor="middle" font-size="13">${esc(opt.xLabel)}</text>`,
    `<text transform="translate(22 ${M.top + ph / 2}) rotate(-90)" text-anchor="middle" font-size="13">${esc(opt.yLabel)}</text>`,
  );
  // Legend (top left inside the plot).
  const lx = M.left + 12;
  let ly = M.top + 16;
  out.push(
    `<rect x="${lx - 6}" y="${ly - 12}" width="230" height="${18 * (series.length + 2) + 6}" fill="#ffffff" stroke="#bbb"/>`,
  );
  series.forEach((s, i) => {
    const c = COLOURS[i % COLOURS.length];
    out.push(
      i % 2 === 0
        ? `<circle cx="${lx + 6}" cy="${ly - 4}" r="3.2" fill="none" stroke="${c}" stroke-width="1.3"/>`
        : `<rect x="${lx + 3}" y="${ly - 7}" width="6" height="6" fill="none" stroke="${c}" stroke-width="1.3"/>`,
      `<text x="${lx + 18}" y="${ly}">${esc(s.label)}</text>`,
    );
    ly += 18;
  });
  out.push(
    `<line x1="${lx}" y1="${ly - 4}" x2="${lx + 12}" y2="${ly - 4}" stroke="#333" stroke-width="1.2"/>`,
    `<text x="${lx + 18}" y="${ly}">1:1 (predicted = observed)</text>`,
  );
  ly += 18;
  out.push(
    `<line x1="${lx}" y1="${ly - 4}" x2="${lx + 12}" y2="${ly - 4}" stroke="#333" stroke-width="1.2" stroke-dasharray="6 4"/>`,
    `<text x="${lx + 18}" y="${ly}">factor of two (×2, ÷2)</text>`,
  );
  out.push("</svg>", "");
  return out.join("\n");
}
