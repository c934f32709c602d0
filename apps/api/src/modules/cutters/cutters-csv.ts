/**
 * Ringdown's own CSV column set for cutter lists (documented in docs/csv-cutters.md): snake_case
 * headers with the unit in the name. Lengths may be given in millimetres (`diameter_mm`) or inches
 * (`diameter_in`, converted exactly: 1 in = 25.4 mm). Parsing and writing use csv-parse and
 * csv-stringify; this file only maps columns onto the cutter contract and back.
 */
import { parse } from "csv-parse/sync";
import { stringify } from "csv-stringify/sync";
import {
  cutterCreateBodySchema,
  cutterShapes,
  cutterStatuses,
  toolMaterials,
  type Cutter,
  type CutterCreateBody,
  type CutterImportRow,
  type CutterStatus,
} from "@ringdown/contracts";

/** Exact by definition (international inch, 1959). */
export const MM_PER_INCH = 25.4;
/** Largest upload accepted by the import route. */
export const MAX_CSV_BYTES = 1024 * 1024;
/** Most data rows in one import (a shop's whole cutter list fits many times over). */
export const MAX_CSV_ROWS = 5000;

type FieldKey = keyof CutterCreateBody;
type ColumnKind = "text" | "number" | "integer" | "length" | "shape" | "toolMaterial" | "status";

interface ColumnDef {
  field: FieldKey;
  /** Base header; lengths get `_mm` / `_in` appended, other headers carry their unit already. */
  header: string;
  kind: ColumnKind;
  required: boolean;
}

/** Column order of an export (and of the template in the docs). */
export const columns: ColumnDef[] = [
  { field: "name", header: "name", kind: "text", required: true },
  { field: "shape", header: "shape", kind: "shape", required: true },
  { field: "toolMaterial", header: "tool_material", kind: "toolMaterial", required: true },
  { field: "status", header: "status", kind: "status", required: false },
  { field: "diameterMm", header: "diameter", kind: "length", required: true },
  { field: "flutes", header: "flutes", kind: "integer", required: true },
  { field: "fluteLengthMm", header: "flute_length", kind: "length", required: true },
  { field: "overallLengthMm", header: "overall_length", kind: "length", required: true },
  { field: "shankDiameterMm", header: "shank_diameter", kind: "length", required: true },
  { field: "cornerRadiusMm", header: "corner_radius", kind: "length", required: false },
  { field: "helixDeg", header: "helix_deg", kind: "number", required: false },
  { field: "tipAngleDeg", header: "tip_angle_deg", kind: "number", required: false },
  { field: "maxRpm", header: "max_rpm", kind: "number", required: false },
  { field: "coating", header: "coating", kind: "text", required: false },
  { field: "maker", header: "maker", kind: "text", required: false },
  { field: "partNumber", header: "part_number", kind: "text", required: false },
  { field: "notes", header: "notes", kind: "text", required: false },
];

/** Value of an optional column left blank (or left out). */
const blankValue: Partial<Record<FieldKey, unknown>> = {
  helixDeg: 0,
  cornerRadiusMm: 0,
  tipAngleDeg: null,
  maxRpm: null,
  coating: "",
  maker: "",
  partNumber: "",
  notes: "",
};

export type UnitChoice = "metric" | "imperial";

function headersOf(col: ColumnDef): string[] {
  return col.kind === "length" ? [`${col.header}_mm`, `${col.header}_in`] : [col.header];
}

/** Every header the import understands. */
export const knownHeaders: string[] = columns.flatMap(headersOf);

// Spreadsheets run cells that start with these as formulas; exports defuse them with a leading
// apostrophe, which imports remove again.
const FORMULA_START = /^[=+\-@\t\r]/;

const norm = (value: string) => value.trim().toLowerCase().replace(/[\s-]+/g, "_");

export interface ParsedCsv {
  fileErrors: string[];
  rows: CutterImportRow[];
}

export interface ParseOptions {
  /** Status of a row whose status cell is blank. */
  defaultStatus: CutterStatus;
  /** Lower-cased names of the shop's cutters, to warn about likely duplicates. */
  existingNames: Set<string>;
}

function decodeUtf8(bytes: Buffer): string | null {
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return null;
  }
}

/** Reads a number cell: plain decimal (a decimal comma too in semicolon-separated files). */
function readNumber(cell: string, decimalComma: boolean): number | null {
  const text = decimalComma ? cell.replace(",", ".") : cell;
  if (!/^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/.test(text)) return null;
  return Number(text);
}

/**
 * Parses a cutter CSV into one report row per data row. Nothing here touches the database: the
 * caller decides whether to write.
 */
export function parseCutterCsv(bytes: Buffer, options: ParseOptions): ParsedCsv {
  const text = decodeUtf8(bytes);
  if (text === null) {
    return { fileErrors: ["The file is not UTF-8 text. Save it as “CSV UTF-8” and try again."], rows: [] };
  }
  const firstLine = text.replace(/^\uFEFF/, "").split(/\r?\n/, 1)[0] ?? "";
  const delimiter = firstLine.includes(";") && !firstLine.includes(",") ? ";" : ",";
  const decimalComma = delimiter === ";";

  let records: Array<{ record: string[]; info: { lines: number } }>;
  try {
    records = parse(text, { bom: true, info: true, relax_column_count: true, skip_empty_lines: true, delimiter }) as unknown as Array<{
      record: string[];
      info: { lines: number };
    }>;
  } catch (error) {
    const e = error as { message?: string; lines?: number };
    const where = typeof e.lines === "number" ? ` (near line ${e.lines})` : "";
    return { fileErrors: [`The file is not valid CSV${where}: ${e.message ?? "unreadable"}`], rows: [] };
  }

  const [headerRecord, ...data] = records;
  if (!headerRecord) return { fileErrors: ["The file is empty: expected a header row and cutter rows."], rows: [] };
  const headers = headerRecord.record.map((h) => h.trim().toLowerCase());

  const fileErrors: string[] = [];
  const unknown = headers.filter((h) => h !== "" && !knownHeaders.includes(h));
  if (unknown.length > 0) {
    fileErrors.push(
      `Unknown column${unknown.length > 1 ? "s" : ""}: ${unknown.join(", ")}. ` +
        "Use the columns in the cutter CSV guide (lengths end in _mm or _in).",
    );
  }
  const repeated = headers.filter((h, i) => h !== "" && headers.indexOf(h) !== i);
  if (repeated.length > 0) fileErrors.push(`Column given twice: ${[...new Set(repeated)].join(", ")}.`);
  for (const col of columns.filter((c) => c.required)) {
    if (!headersOf(col).some((h) => headers.includes(h))) {
      fileErrors.push(`Missing column: ${headersOf(col).join(" or ")}.`);
    }
  }
  if (data.length === 0) fileErrors.push("The file has no cutter rows under the header.");
  if (data.length > MAX_CSV_ROWS) fileErrors.push(`The file has ${data.length} rows; import at most ${MAX_CSV_ROWS} at once.`);
  if (fileErrors.length > 0 && (data.length === 0 || data.length > MAX_CSV_ROWS)) return { fileErrors, rows: [] };

  const seenNames = new Map<string, number>();
  const rows = data.map(({ record, info }) => {
    const newlinesInside = record.reduce((n, cell) => n + (cell.match(/\n/g)?.length ?? 0), 0);
    const line = info.lines - newlinesInside;
    const values: Record<string, string> = {};
    headers.forEach((h, i) => {
      if (h !== "") values[h] = (record[i] ?? "").trim();
    });
    const row = readRow(values, options, decimalComma);
    if (record.length !== headers.length) {
      row.errors.row = `This row has ${record.length} cells; the header has ${headers.length}.`;
      row.cutter = null;
    }
    const name = row.cutter?.name.toLowerCase();
    if (name) {
      if (options.existingNames.has(name)) row.warnings.push("The shop already has a cutter with this name.");
      const earlier = seenNames.get(name);
      if (earlier !== undefined) row.warnings.push(`Same name as the row on line ${earlier}.`);
      else seenNames.set(name, line);
    }
    return { line, values, ...row };
  });
  return { fileErrors, rows };
}

function readRow(
  values: Record<string, string>,
  options: ParseOptions,
  decimalComma: boolean,
): Omit<CutterImportRow, "line" | "values"> {
  const errors: Record<string, string> = {};
  const raw: Record<string, unknown> = {};
  /** Which header each field came from, to report schema errors against the user's column. */
  const headerOf: Partial<Record<FieldKey, string>> = {};
  /** Fields whose cell already has an error (the schema's message for them would only repeat it). */
  const failed = new Set<FieldKey>();

  for (const col of columns) {
    const present = headersOf(col).filter((h) => (values[h] ?? "") !== "");
    headerOf[col.field] = present[0] ?? headersOf(col).find((h) => h in values) ?? headersOf(col)[0];
    if (present.length > 1) {
      errors[`${col.header}_in`] = `Give ${col.header.replace(/_/g, " ")} in mm or in inches, not both.`;
      failed.add(col.field);
      continue;
    }
    const header = present[0];
    if (header === undefined) {
      if (col.field === "status") raw.status = options.defaultStatus;
      else if (col.field in blankValue) raw[col.field] = blankValue[col.field];
      // A blank required cell is left out; the schema says what is missing.
      continue;
    }
    let cell = values[header]!;
    const fail = (column: string, message: string) => {
      errors[column] = message;
      failed.add(col.field);
    };
    switch (col.kind) {
      case "text":
        if (cell.startsWith("'") && FORMULA_START.test(cell.slice(1))) cell = cell.slice(1);
        raw[col.field] = cell;
        break;
      case "shape": {
        const v = norm(cell);
        if ((cutterShapes as readonly string[]).includes(v)) raw.shape = v;
        else fail(header, `Unknown shape “${cell}”. Use one of: ${cutterShapes.join(", ")}.`);
        break;
      }
      case "toolMaterial": {
        const v = norm(cell);
        if ((toolMaterials as readonly string[]).includes(v)) raw.toolMaterial = v;
        else fail(header, `Unknown tool material “${cell}”. Use one of: ${toolMaterials.join(", ")}.`);
        break;
      }
      case "status": {
        const v = norm(cell);
        if ((cutterStatuses as readonly string[]).includes(v)) raw.status = v;
        else fail(header, `Unknown status “${cell}”. Use one of: ${cutterStatuses.join(", ")}.`);
        break;
      }
      default: {
        const n = readNumber(cell, decimalComma);
        if (n === null) {
          fail(header, `“${cell}” is not a number.`);
          break;
        }
        raw[col.field] = col.kind === "length" && header.endsWith("_in") ? n * MM_PER_INCH : n;
      }
    }
  }

  // Status "retired" is allowed in a file (a full list round-trips); the create schema only knows
  // proposed/approved, so check the rest with it and put the status back afterwards.
  const status = raw.status as CutterStatus | undefined;
  const parsed = cutterCreateBodySchema.safeParse({ ...raw, status: status === "retired" ? "approved" : status });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const field = issue.path[0] as FieldKey | undefined;
      if (field && failed.has(field)) continue;
      const header = field ? (headerOf[field] ?? String(field)) : "row";
      if (errors[header]) continue;
      const inInches = header.endsWith("_in") ? " (after converting to mm)" : "";
      errors[header] = `${issue.message}${inInches}`;
    }
  }
  const ok = parsed.success && Object.keys(errors).length === 0;
  return { errors, warnings: [], cutter: ok ? { ...parsed.data, status: status ?? options.defaultStatus } : null };
}

/** Decimal places of an inch length in an export: 1e-6 in (0.0000254 mm). */
export const INCH_DECIMALS = 6;

/** A number rounded to `decimals` places, without trailing zeros ("0.25", not "0.250000"). */
export function roundedCell(value: number, decimals: number): string {
  return String(Number(value.toFixed(decimals)));
}

/** Formats a number cell: shortest exact form for mm; inches rounded to INCH_DECIMALS places. */
function numberCell(value: number | null, inches = false): string {
  if (value === null) return "";
  return inches ? roundedCell(value / MM_PER_INCH, INCH_DECIMALS) : String(value);
}

/** A text cell a spreadsheet shows as text: one that would start a formula gets a leading `'`. */
export function textCell(value: string | null | undefined): string {
  const text = value ?? "";
  return FORMULA_START.test(text) ? `'${text}` : text;
}

/** CSV text of a header and rows: UTF-8 with a byte-order mark (so spreadsheets read it as UTF-8), CRLF line ends (RFC 4180). */
export function csvText(header: string[], rows: string[][]): string {
  return `\uFEFF${stringify([header, ...rows], { record_delimiter: "\r\n" })}`;
}

/** Header row of an export in the given units. */
export function exportHeaders(units: UnitChoice): string[] {
  return columns.map((c) => (c.kind === "length" ? `${c.header}_${units === "imperial" ? "in" : "mm"}` : c.header));
}

/** The cutters as CSV text. */
export function cuttersToCsv(cutters: Cutter[], units: UnitChoice): string {
  const rows = cutters.map((c) =>
    columns.map((col) => {
      const value = c[col.field as keyof Cutter];
      switch (col.kind) {
        case "length":
          return numberCell(value as number, units === "imperial");
        case "number":
        case "integer":
          return numberCell(value as number | null);
        case "text":
          return textCell(value as string);
        default:
          return String(value);
      }
    }),
  );
  return csvText(exportHeaders(units), rows);
}
