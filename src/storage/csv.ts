/**
 * A small CSV reader and writer after RFC 4180 (Shafranovich 2005, "Common Format and MIME Type
 * for Comma-Separated Values (CSV) Files"): comma-separated fields, fields in double quotes may
 * hold commas, line breaks and doubled quotes (""). Also accepted, as the RFC's §2 notes common
 * practice: a UTF-8 byte order mark at the start, LF as well as CRLF line ends, no line end after
 * the last record. Blank lines are skipped. The reader keeps each record's line number, so a
 * message can name the row the user sees in a spreadsheet or editor.
 */

export interface CsvRecord {
  /** 1-based line number on which the record starts. */
  line: number;
  fields: string[];
}

/** A CSV text that cannot be split into records (an unclosed or stray quote). */
export class CsvSyntaxError extends Error {
  constructor(
    readonly line: number,
    /** 1-based field position in the record. */
    readonly column: number,
    why: string,
  ) {
    super(why);
    this.name = "CsvSyntaxError";
  }
}

/**
 * Splits CSV text into records.
 * @throws CsvSyntaxError for a quote that is not closed, or text after a closing quote
 */
export function parseCsv(text: string): CsvRecord[] {
  const s = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const records: CsvRecord[] = [];
  let fields: string[] = [];
  let field = "";
  /** The current field was quoted (and is complete). */
  let quoted = false;
  let line = 1;
  let recordLine = 1;
  let i = 0;
  const n = s.length;
  const endRecord = () => {
    // A blank line (nothing at all on it) is not a record.
    if (fields.length > 0 || field !== "" || quoted) {
      fields.push(field);
      records.push({ line: recordLine, fields });
    }
    fields = [];
    field = "";
    quoted = false;
  };
  while (i < n) {
    const c = s[i];
    if (c === "," || c === "\n" || c === "\r") {
      if (c === ",") {
        fields.push(field);
        field = "";
        quoted = false;
        i++;
        continue;
      }
      endRecord();
      i += c === "\r" && s[i + 1] === "\n" ? 2 : 1;
      line++;
      recordLine = line;
      continue;
    }
    if (c === '"' && field === "" && !quoted) {
      const startLine = line;
      let value = "";
      let from = i + 1;
      let closed = false;
      while (from <= n) {
        const q = s.indexOf('"', from);
        if (q < 0) break;
        value += s.slice(from, q);
        if (s[q + 1] === '"') {
          value += '"';
          from = q + 2;
          continue;
        }
        i = q + 1;
        closed = true;
        break;
      }
      if (!closed) {
        throw new CsvSyntaxError(startLine, fields.length + 1, "a quoted field is not closed");
      }
      for (const ch of value) if (ch === "\n") line++;
      field = value;
      quoted = true;
      const next = s[i];
      if (i < n && next !== "," && next !== "\n" && next !== "\r") {
        throw new CsvSyntaxError(
          line,
          fields.length + 1,
          "text follows a closing quote (write a quote inside a quoted field as two quotes)",
        );
      }
      continue;
    }
    if (c === '"') {
      throw new CsvSyntaxError(
        line,
        fields.length + 1,
        "a quote inside an unquoted field (put the whole field in quotes and double the quote)",
      );
    }
    // A plain run up to the next delimiter.
    let j = i;
    while (j < n) {
      const d = s[j];
      if (d === "," || d === "\n" || d === "\r" || d === '"') break;
      j++;
    }
    field += s.slice(i, j);
    i = j;
  }
  endRecord();
  return records;
}

/** One field as RFC 4180 writes it: quoted when it holds a comma, quote, CR or LF. */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}

/** Records → CSV text with CRLF line ends (RFC 4180 §2.1), a line end after the last record. */
export function writeCsv(rows: readonly (readonly string[])[]): string {
  return rows.map((r) => `${r.map(csvField).join(",")}\r\n`).join("");
}
