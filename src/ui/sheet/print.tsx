/**
 * "Print this estimate": puts the estimate sheet on the page alone and opens the browser's print
 * dialog (A4 or US Letter, one page: see sheet.css). The sheet is removed after printing.
 * Loaded on demand, never with the first screen.
 */
import { render } from "preact";
import { EstimateSheet, type SheetProps } from "./EstimateSheet.tsx";
import "./sheet.css";

const HOST_ID = "dm-print-sheet";

/** Renders the sheet for printing and returns its element (left in place until `afterprint`). */
export function showSheet(props: SheetProps): HTMLElement {
  let host = document.getElementById(HOST_ID);
  if (!host) {
    host = document.createElement("div");
    host.id = HOST_ID;
    document.body.append(host);
  }
  render(<EstimateSheet {...props} />, host);
  fitPage(host);
  document.documentElement.classList.add("dm-printing");
  return host;
}

/** The printable height common to A4 and US Letter with 12 mm margins: 255 mm in CSS px. */
const PAGE_HEIGHT_PX = (255 / 25.4) * 96;

/**
 * Shrinks the sheet to one page when it is taller (many limits, places or warnings): measured
 * off screen at its print width, then scaled with CSS zoom so nothing is cut off.
 */
function fitPage(host: HTMLElement): void {
  const sheet = host.firstElementChild as HTMLElement | null;
  if (!sheet) return;
  sheet.style.zoom = "";
  host.style.cssText = "display:block;position:absolute;left:-10000px;top:0;visibility:hidden";
  const height = sheet.scrollHeight;
  host.style.cssText = "";
  if (height > PAGE_HEIGHT_PX)
    sheet.style.zoom = String(Math.floor((PAGE_HEIGHT_PX / height) * 100) / 100);
}

/** Removes the sheet and the print mode. */
export function hideSheet(): void {
  const host = document.getElementById(HOST_ID);
  if (host) {
    render(null, host);
    host.remove();
  }
  document.documentElement.classList.remove("dm-printing");
}

/** Shows the sheet and opens the print dialog; the sheet goes away once printing is done. */
export function printSheet(props: SheetProps): void {
  showSheet(props);
  window.addEventListener("afterprint", hideSheet, { once: true });
  window.print();
}
