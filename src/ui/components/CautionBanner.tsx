import { CAUTION } from "../../core/caution.ts";

/** The caution: always on top of every view, never dismissable. */
export function CautionBanner({
  onLimits,
  showingLimits,
}: {
  onLimits: () => void;
  showingLimits: boolean;
}) {
  return (
    <header class="caution">
      <p class="caution-text">
        <strong>{CAUTION}</strong>
      </p>
      <button type="button" class="caution-link" onClick={onLimits} aria-expanded={showingLimits}>
        {showingLimits ? "Back to the estimate" : "What this model cannot do"}
      </button>
    </header>
  );
}
