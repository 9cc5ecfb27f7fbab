// "Ready to work offline" / "Update available — reload": the service worker's state in words.
// The update is applied only when the user taps the button; nothing reloads by itself.
import { requestUpdate, useSwStatus } from "./sw-status.ts";

export function UpdateStatus() {
  const { offlineReady, updateWaiting } = useSwStatus();
  if (!offlineReady && !updateWaiting) return null;
  return (
    <div class="dm-sw-status" role="status" aria-live="polite" data-testid="sw-status">
      {updateWaiting ? (
        <>
          <span>A new version is ready.</span>
          <button type="button" class="dm-sw-status__button" onClick={requestUpdate}>
            Update available — reload
          </button>
        </>
      ) : (
        <span>Ready to work offline</span>
      )}
    </div>
  );
}
