/** The caution carried by every result, screen and export (glossary: Caution). */
export const CAUTION = "Screening estimate only — follow incident command and local authority";

/** Version of the estimating model; stored with every logged estimate. Bump when any number can change. */
export const MODEL_VERSION = "driftmark-model-5";
