/**
 * Handing a file to the user: Web Share with a file where the device can share it, else a
 * download through a Blob URL; and copying text to the clipboard. Browser only.
 */
import { CAUTION } from "../core/caution.ts";
import type { OutFile } from "./files.ts";

export type ShareOutcome = "shared" | "downloaded" | "cancelled";

/** Navigator with the optional Web Share methods (not in every lib.dom). */
type ShareNavigator = Navigator & {
  canShare?: (data: ShareData) => boolean;
  share?: (data: ShareData) => Promise<void>;
};

function shareableFile(f: OutFile): File | null {
  if (typeof navigator === "undefined" || typeof File === "undefined") return null;
  const nav = navigator as ShareNavigator;
  if (typeof nav.canShare !== "function" || typeof nav.share !== "function") return null;
  // Some browsers accept only a short list of types for sharing; try the exact type, then JSON.
  for (const type of [f.mime, "application/json", "text/plain"]) {
    const file = new File([f.text], f.name, { type });
    try {
      if (nav.canShare({ files: [file] })) return file;
    } catch {
      // canShare may throw on unknown types: try the next
    }
  }
  return null;
}

/** Whether `shareFile` would use the share sheet (else it downloads). */
export function canShareFile(f: OutFile): boolean {
  return shareableFile(f) !== null;
}

/** Saves a file through a temporary Blob URL and a download link. */
export function downloadFile(f: OutFile): void {
  const url = URL.createObjectURL(new Blob([f.text], { type: f.mime }));
  const a = document.createElement("a");
  a.href = url;
  a.download = f.name;
  a.rel = "noopener";
  a.style.display = "none";
  document.body.append(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(url), 60_000);
}

/**
 * Shares the file through the share sheet when the device can share files, else downloads it.
 * Resolves "cancelled" when the user closes the share sheet (AbortError).
 */
export async function shareFile(f: OutFile, title: string): Promise<ShareOutcome> {
  const file = shareableFile(f);
  if (file) {
    try {
      await (navigator as ShareNavigator).share?.({ files: [file], title, text: CAUTION });
      return "shared";
    } catch (e) {
      if (e && typeof e === "object" && (e as { name?: string }).name === "AbortError") {
        return "cancelled";
      }
      // Not allowed here (e.g. no user gesture): fall back to a download.
    }
  }
  downloadFile(f);
  return "downloaded";
}

/** Copies text to the clipboard; resolves false when the browser refuses. */
export async function copyText(text: string): Promise<boolean> {
  try {
    if (typeof navigator !== "undefined" && navigator.clipboard?.writeText) {
      await navigator.clipboard.writeText(text);
      return true;
    }
  } catch {
    // fall through to the older way
  }
  try {
    const ta = document.createElement("textarea");
    ta.value = text;
    ta.setAttribute("readonly", "");
    ta.style.position = "fixed";
    ta.style.opacity = "0";
    document.body.append(ta);
    ta.select();
    const ok = document.execCommand("copy");
    ta.remove();
    return ok;
  } catch {
    return false;
  }
}

/** Reads a chosen file as text, refusing files over `maxBytes` before reading them. */
export async function readFileText(file: Blob, maxBytes: number): Promise<string> {
  if (file.size > maxBytes) {
    throw new RangeError(
      `The file is too large (${(file.size / 1048576).toFixed(1)} MB; at most ${Math.round(maxBytes / 1048576)} MB).`,
    );
  }
  return file.text();
}
