// Placeholder until the estimate screen lands (issue 3, UI). Renders the caution only.
import { CAUTION } from "../core/caution.ts";

export function App() {
  return (
    <main>
      <p role="note">{CAUTION}</p>
    </main>
  );
}
