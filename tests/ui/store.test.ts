/**
 * The screen's reducer (src/ui/store.ts): each action is one named change of the form.
 */
import { describe, expect, it } from "vitest";
import demo from "../../examples/demo.json" with { type: "json" };
import type { Scenario } from "../../src/core/types.ts";
import { initialForm } from "../../src/ui/form.ts";
import { reduce, type ScreenState } from "../../src/ui/store.ts";

const start: ScreenState = { form: initialForm(), origin: "user" };

describe("reduce", () => {
  it("loads the demo marked as demo, and marks it edited on the first change", () => {
    const d = reduce(start, {
      type: "load",
      scenario: demo as unknown as Scenario,
      origin: "demo",
    });
    expect(d.origin).toBe("demo");
    expect(d.form.limits).toHaveLength((demo as unknown as Scenario).limits.length);
    const e = reduce(d, { type: "set", key: "windSpeed", value: "5" });
    expect(e.origin).toBe("demo-edited");
    expect(e.form.windSpeed).toBe("5");
    expect(reduce(e, { type: "clear" })).toEqual({ form: initialForm(), origin: "user" });
  });

  it("adds, edits and removes limits by place", () => {
    let s = reduce(start, { type: "addLimit" });
    expect(s.form.limits).toHaveLength(2);
    s = reduce(s, { type: "setLimit", index: 1, patch: { value: "7" } });
    expect(s.form.limits[1]?.value).toBe("7");
    expect(s.form.limits[0]?.value).toBe("");
    s = reduce(s, { type: "template", index: 1, templateId: "ERPG-2" });
    expect(s.form.limits[1]).toMatchObject({ name: "ERPG-2", averagingMin: "60", value: "7" });
    s = reduce(s, { type: "removeLimit", index: 0 });
    expect(s.form.limits).toHaveLength(1);
    expect(s.form.limits[0]?.name).toBe("ERPG-2");
  });

  it("sets the place from a position fix", () => {
    const s = reduce(start, { type: "place", lat: "46.5", lon: "7.25" });
    expect([s.form.lat, s.form.lon]).toEqual(["46.5", "7.25"]);
  });
});
