import { describe, expect, it } from "vitest";
import { csvCell, toCsv } from "./csv";

// Oracles: RFC 4180 §2 (rules 1, 5, 6 and 7, with the examples written out by hand below) and OWASP's
// "CSV Injection" page (cells starting with =, +, -, @, tab or carriage return are run as formulas).
describe("CSV export", () => {
  it("ends every record, the last one too, with CRLF (RFC 4180 §2 rules 1 and 2)", () => {
    expect(toCsv(["a", "b"], [["x", 1]])).toBe("a,b\r\nx,1\r\n");
  });

  it("quotes fields with commas, quotes or line breaks and doubles inner quotes (rules 5, 6, 7)", () => {
    expect(csvCell("Banda, Mwila")).toBe('"Banda, Mwila"');
    expect(csvCell('The "Green Reed" hatchery')).toBe('"The ""Green Reed"" hatchery"');
    expect(csvCell("line one\nline two")).toBe('"line one\nline two"');
    expect(csvCell("plain")).toBe("plain");
    expect(csvCell(null)).toBe("");
  });

  it("neutralises text that a spreadsheet would run as a formula, but not numbers (OWASP CSV Injection)", () => {
    expect(csvCell("=HYPERLINK(\"http://x\")")).toBe("\"'=HYPERLINK(\"\"http://x\"\")\"");
    expect(csvCell("+260971234567")).toBe("'+260971234567");
    expect(csvCell("@sum")).toBe("'@sum");
    expect(csvCell("-1")).toBe("'-1");
    expect(csvCell(-1)).toBe("-1");
  });

  it("refuses a record with the wrong number of fields (rule 4: each line the same number of fields)", () => {
    expect(() => toCsv(["a", "b"], [["only one"]])).toThrow(RangeError);
  });
});
