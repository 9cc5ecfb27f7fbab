/**
 * The footprint area of the screen: the plain drawing (FootprintView, SVG) at first, then, once
 * the first estimate is on screen, the deferred map part (MapPart: kept map areas, and the map
 * when an area holds the source). Small on purpose: it is part of the first screen.
 */
import type { ComponentType } from "preact";
import { useEffect, useState } from "preact/hooks";
import type { EstimateOutput, Scenario } from "../../core/types.ts";
import { FootprintView } from "../components/FootprintView.tsx";
import type { BandStyle } from "../palette.ts";
import type { UnitSystem } from "../units.ts";
import type { MapPartProps } from "./MapPart.tsx";

let part: Promise<ComponentType<MapPartProps>> | null = null;
/** Loads the deferred map part once. */
export const loadMapPart = () => {
  part ??= import("./MapPart.tsx").then((m) => m.MapPart);
  return part;
};

export interface FootprintAreaProps {
  scenario: Scenario;
  output: EstimateOutput;
  styles: readonly BandStyle[];
  units: UnitSystem;
  placeText: string;
  night: boolean;
  position?: MapPartProps["position"];
  onPutSource?: MapPartProps["onPutSource"];
  onAddPlace?: MapPartProps["onAddPlace"];
  onFix?: MapPartProps["onFix"];
  extraFeatures?: MapPartProps["extraFeatures"];
}

export function FootprintArea(props: FootprintAreaProps) {
  const [Part, setPart] = useState<ComponentType<MapPartProps> | null>(null);
  useEffect(() => {
    let live = true;
    const start = () =>
      loadMapPart().then(
        (C) => live && setPart(() => C),
        () => undefined,
      );
    if ("requestIdleCallback" in window) window.requestIdleCallback(start, { timeout: 1000 });
    else setTimeout(start, 100);
    return () => {
      live = false;
    };
  }, []);
  const plain = (
    <FootprintView
      output={props.output}
      styles={props.styles}
      units={props.units}
      placeText={props.placeText}
    />
  );
  if (!Part) return plain;
  return (
    <Part
      scenario={props.scenario}
      output={props.output}
      units={props.units}
      night={props.night}
      summary={`Bands of each limit over the map area, labelled at their far ends; the crosshair marks the map centre. ${props.placeText}`}
      plain={plain}
      position={props.position}
      onPutSource={props.onPutSource}
      onAddPlace={props.onAddPlace}
      onFix={props.onFix}
      extraFeatures={props.extraFeatures}
    />
  );
}
