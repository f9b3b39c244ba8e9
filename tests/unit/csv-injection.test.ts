/**
 * CSV exports never hand a spreadsheet a formula: text cells starting with =, +, -, @, tab or CR
 * get a leading apostrophe (OWASP, "CSV Injection"), numbers stay exactly as computed.
 */
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { csvCell, writeCsv } from '../../src/io/csv-common';
import { locateSensorsToCsv, parseLocateCsv } from '../../src/io/locate-csv';
import { parsePlanFile, planFileToInput } from '../../src/io/plan-file';
import { computePlan } from '../../src/physics';
import { tableExport, tableTsv } from '../../src/ui/converter/export-text';
import { tableCsv } from '../../src/ui/export/csv-export';
import { resultsCsv } from '../../src/ui/planner/results-csv';

const HOSTILE = ['=1+1', '=HYPERLINK("http://example.invalid","x")', '+SUM(A1:A2)', '-2+3', '@SUM(A1)', '\t=1+1', '\r=1+1'];

describe('formula cells are neutralised (OWASP CSV injection guidance)', () => {
  it.each(HOSTILE)('%j gets a leading apostrophe', (text) => {
    const cell = csvCell(text);
    expect(cell.replace(/^"/, '').startsWith("'")).toBe(true);
  });

  it('numbers and number-like text are unchanged', () => {
    expect(writeCsv(['a', 'b', 'c', 'd'], [[-2.5, '-1.5', '+3e-7', 1e-300]])).toBe('a,b,c,d\n-2.5,-1.5,+3e-7,1e-300\n');
    expect(csvCell('plain text')).toBe('plain text');
  });

  it('tab-separated copies are neutralised too', () => {
    const tsv = tableTsv({ header: ['id'], rows: [['=1+1'], [-4]] });
    expect(tsv).toBe("id\n'=1+1\n-4\n");
    expect(tableExport('x.csv', { header: ['id'], rows: [['@x']] }).csv).toBe("id\n'@x\n");
  });

  it('a sensor id =1+1 from a shared plan reaches the planner results CSV as text', () => {
    const demo = JSON.parse(readFileSync('public/demo-plan.json', 'utf8')) as { sensors: { id: string }[] };
    (demo.sensors[0] as { id: string }).id = '=1+1';
    const parsed = parsePlanFile(JSON.stringify(demo));
    if (!parsed.ok) throw new Error(parsed.errors.join('; '));
    const csv = tableCsv(resultsCsv(computePlan(planFileToInput(parsed.plan))));
    expect(csv.split('\r\n')[1]?.startsWith("'=1+1,")).toBe(true);
    expect(csv).not.toMatch(/(^|,)=1\+1/m);
  });

  it('locate sensor CSV: a hostile label is written as text, coordinates unchanged', () => {
    const input = parseLocateCsv('label,x_m,y_m,z_m,arrival_s\n=HYPERLINK("a"),-0.01,0.02,0.03,0.0012\nb,0,0,0.05,0.0013\n');
    const csv = locateSensorsToCsv(input.sensors);
    expect(csv).toContain(`"'=HYPERLINK(""a"")",-0.01,0.02,0.03,0.0012`);
  });
});
