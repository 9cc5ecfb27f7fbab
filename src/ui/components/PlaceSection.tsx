import { useState } from "preact/hooks";
import { FIELD } from "../form.ts";
import { formatDistance, roundSig, type UnitSystem } from "../units.ts";
import { TextField } from "./Field.tsx";
import { type SectionProps, setter } from "./types.ts";

/** A position from the device: where (degrees) and how accurate (m). */
export interface PositionFix {
  lat: number;
  lon: number;
  accuracyM: number;
}

type GeoStatus =
  | { kind: "idle" }
  | { kind: "asking" }
  | { kind: "got"; accuracyM: number }
  | { kind: "failed"; message: string };

const GEO_ERRORS: Record<number, string> = {
  1: "Position not allowed: permission was refused. Type the latitude and longitude instead.",
  2: "Position not available here. Type the latitude and longitude instead.",
  3: "No position in time. Try again or type the latitude and longitude.",
};

export function PlaceSection({
  form,
  dispatch,
  errors,
  units,
  onFix,
}: SectionProps & {
  units: UnitSystem;
  /** Told of each device position with its accuracy, so the log can keep the accuracy. */
  onFix?: (fix: PositionFix) => void;
}) {
  const set = setter(dispatch);
  const [geo, setGeo] = useState<GeoStatus>({ kind: "idle" });
  const locate = () => {
    if (!("geolocation" in navigator)) {
      setGeo({
        kind: "failed",
        message: "This device offers no position. Type the latitude and longitude.",
      });
      return;
    }
    setGeo({ kind: "asking" });
    navigator.geolocation.getCurrentPosition(
      (pos) => {
        const lat = roundSig(pos.coords.latitude, 8);
        const lon = roundSig(pos.coords.longitude, 8);
        dispatch({ type: "place", lat: String(lat), lon: String(lon) });
        setGeo({ kind: "got", accuracyM: pos.coords.accuracy });
        onFix?.({ lat, lon, accuracyM: pos.coords.accuracy });
      },
      (err) => setGeo({ kind: "failed", message: GEO_ERRORS[err.code] ?? err.message }),
      { enableHighAccuracy: true, timeout: 20_000, maximumAge: 60_000 },
    );
  };
  return (
    <fieldset class="section">
      <legend>Place</legend>
      <button type="button" class="secondary" onClick={locate} disabled={geo.kind === "asking"}>
        Use my position
      </button>
      <p class="hint" role="status">
        {geo.kind === "asking"
          ? "Finding your position…"
          : geo.kind === "got"
            ? `Position found, accurate to about ${formatDistance(geo.accuracyM, units, "up")}.`
            : geo.kind === "failed"
              ? geo.message
              : "Optional. Without a place the footprint is drawn relative to the source."}
      </p>
      <TextField
        id={FIELD.lat}
        label="Latitude"
        value={form.lat}
        onInput={set("lat")}
        errors={errors[FIELD.lat]}
        decimal={false}
        suffix="° N"
      />
      <TextField
        id={FIELD.lon}
        label="Longitude"
        value={form.lon}
        onInput={set("lon")}
        errors={errors[FIELD.lon]}
        decimal={false}
        suffix="° E"
      />
    </fieldset>
  );
}
