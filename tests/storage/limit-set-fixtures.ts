// Invented limit sets for the tests and the bench: names, values and notes are made up (no real
// substance or exposure value). Deterministic: a fixed-seed generator, so every run sees the same file.

export interface FixtureLimit {
  label: string;
  value: string;
  unit: "ppm" | "mg/m3";
  averaging_min: string;
}
export interface FixtureSet {
  name: string;
  mw: string;
  note: string;
  limits: FixtureLimit[];
}

/** Mulberry32 (a small public-domain PRNG), fixed seed. */
function rng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const NOTES = [
  "Invented list, rev. 3",
  'Invented agency list "B", 2026-01',
  "Invented, line one\nline two",
  "",
  "Invented: values, with commas",
];

/** `n` invented sets, 1–4 limits each; some without a molecular weight (mg/m3 limits only). */
export function inventedSets(n: number, seed = 1212): FixtureSet[] {
  const r = rng(seed);
  const sets: FixtureSet[] = [];
  for (let i = 0; i < n; i++) {
    const hasMw = r() < 0.8;
    const k = 1 + Math.floor(r() * 4);
    const limits: FixtureLimit[] = [];
    for (let j = 0; j < k; j++) {
      const unit = hasMw && r() < 0.6 ? "ppm" : "mg/m3";
      // Plain decimals as a person would type them: 0.05, 3, 120, 1.5e3.
      const pick = r();
      const value =
        pick < 0.3
          ? (Math.floor(r() * 999) / 100 + 0.01).toFixed(2)
          : pick < 0.9
            ? String(1 + Math.floor(r() * 5000))
            : `${(1 + Math.floor(r() * 9)).toString()}.5e3`;
      const averaging_min = String([1, 10, 15, 30, 60, 240, 480, 1440][Math.floor(r() * 8)]);
      limits.push({ label: `Tier ${j + 1}, invented`, value, unit, averaging_min });
    }
    sets.push({
      name: `Invented substance ${String(i + 1).padStart(4, "0")}${i % 7 === 0 ? ' "quoted"' : ""}`,
      mw: hasMw ? (10 + Math.floor(r() * 3000) / 10).toFixed(1) : "",
      note: NOTES[i % NOTES.length] as string,
      limits,
    });
  }
  return sets;
}

const q = (s: string) => (/[",\r\n]/.test(s) ? `"${s.replaceAll('"', '""')}"` : s);

/** The sets as a CSV file written by hand (not by the code under test), CRLF, optional BOM. */
export function inventedCsv(sets: readonly FixtureSet[], opts: { bom?: boolean } = {}): string {
  const lines = [
    "set_name,molecular_weight_g_mol,limit_label,value,unit,averaging_min,source_note",
  ];
  for (const s of sets) {
    for (const l of s.limits) {
      lines.push(
        [q(s.name), s.mw, q(l.label), l.value, l.unit, l.averaging_min, q(s.note)].join(","),
      );
    }
  }
  return `${opts.bom ? "\uFEFF" : ""}${lines.join("\r\n")}\r\n`;
}
