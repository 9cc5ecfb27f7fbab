/**
 * Module Web Worker: runs the estimating core off the main thread so typing never waits for a
 * solve. One request at a time, answered in order; see client.ts for latest-wins and the timeout.
 */
import { estimate } from "../../core/index.ts";
import { answer, type EstimateRequest } from "./protocol.ts";

// This file is type-checked with the page's DOM lib; a worker scope needs only these two.
const scope = self as unknown as {
  onmessage: ((ev: MessageEvent<EstimateRequest>) => void) | null;
  postMessage(message: unknown): void;
};

scope.onmessage = (ev) => {
  scope.postMessage(answer(ev.data, estimate));
};
