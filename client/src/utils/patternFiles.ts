import type { PatternFileFormat } from '@/api/patterns';

/** A pattern's export file name: its name as a slug, then ".lanewright.json" or ".lanewright.csv". */
export function patternFileName(name: string, format: PatternFileFormat): string {
  const slug =
    name
      .trim()
      .toLowerCase()
      .replace(/[^a-z0-9]+/g, '-')
      .replace(/^-|-$/g, '') || 'pattern';
  return `${slug}.lanewright.${format}`;
}

/** The file's field names in the words of the sweeps table. */
export const FILE_FIELD_LABELS: Readonly<Record<string, string>> = {
  direction: 'direction',
  fromBoard: 'from board',
  toBoard: 'to board',
  startFt: 'start (ft)',
  endFt: 'end (ft)',
  crossings: 'crossings',
  microlitersPerBoard: 'oil per board (µL)',
};

/** An import's refusal (`fields` keyed `lines.<line>.<field>`) as one message per line, in the sweeps table's words, in line order. */
export function importErrorLines(fields: Readonly<Record<string, string>>): { line: number; text: string }[] {
  return Object.entries(fields)
    .map(([key, text]) => {
      const m = /^lines\.(\d+)(?:\.(.+))?$/.exec(key);
      const where = m?.[2] ? (FILE_FIELD_LABELS[m[2]] ?? m[2]) : '';
      return { line: m ? Number(m[1]) : 0, text: where ? `${where}: ${text}` : text };
    })
    .sort((a, b) => a.line - b.line);
}
