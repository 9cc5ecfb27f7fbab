// "Ready to work offline" / "Update available — reload": the service worker's state in words.
// The update is applied only when the user taps the button; nothing reloads by itself.
import { requestUpdate, useSwStatus } from "./sw-status.ts";

export function UpdateStatus() {
  const { offlineReady, updateWaiting } = useSwStatus();
  if (!offlineReady && !updateWaiting) return null;
  return (
    <aside class="dm-sw-status" aria-label="Offline status" data-testid="sw-status">
      <p class="dm-sw-status__text" role="status">
        {updateWaiting ? "A new version is ready." : "Ready to work offline"}
      </p>
      {updateWaiting ? (
        <button type="button" class="dm-sw-status__button" onClick={requestUpdate}>
          Update available — reload
        </button>
      ) : null}
    </aside>
  );
}
