/**
 * The invented demo scenario (examples/demo.json, shared with the command-line estimator):
 * not a real incident, chemical or exposure value; the screen marks it "Invented demo scenario".
 */
import demo from "../../examples/demo.json";
import type { Scenario } from "../core/types.ts";

export const DEMO_SCENARIO: Scenario = demo as Scenario;
