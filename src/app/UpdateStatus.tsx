// "Ready to work offline" / "Update available — reload": the service worker's state in words.
// The update is applied only when the user taps the button; nothing reloads by itself, and the
// offer waits until the user has stopped typing for a moment, so it never jumps in mid-entry.
import { useEffect, useState } from "preact/hooks";
import { requestUpdate, useSwStatus } from "./sw-status.ts";

/** Quiet time after the last keystroke before an update is offered (ms). */
export const TYPING_QUIET_MS = 4000;

/** True while the user has typed in the last `quietMs`. */
function useTyping(quietMs: number): boolean {
  const [typing, setTyping] = useState(false);
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | undefined;
    const onInput = () => {
      setTyping(true);
      clearTimeout(timer);
      timer = setTimeout(() => setTyping(false), quietMs);
    };
    document.addEventListener("input", onInput, true);
    document.addEventListener("keydown", onInput, true);
    return () => {
      clearTimeout(timer);
      document.removeEventListener("input", onInput, true);
      document.removeEventListener("keydown", onInput, true);
    };
  }, [quietMs]);
  return typing;
}

export function UpdateStatus() {
  const { offlineReady, updateWaiting } = useSwStatus();
  const typing = useTyping(TYPING_QUIET_MS);
  const offer = updateWaiting && !typing;
  if (!offlineReady && !offer) return null;
  return (
    <aside class="dm-sw-status" aria-label="Offline status" data-testid="sw-status">
      <p class="dm-sw-status__text" role="status">
        {offer ? "A new version is ready." : "Ready to work offline"}
      </p>
      {offer ? (
        <button type="button" class="dm-sw-status__button" onClick={requestUpdate}>
          Update available — reload
        </button>
      ) : null}
    </aside>
  );
}
