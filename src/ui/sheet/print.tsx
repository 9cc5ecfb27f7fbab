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
  document.documentElement.classList.add("dm-printing");
  return host;
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
