// Splits an MDL SD file into its records. Each record is a molfile (header block, counts line, atom
// and bond blocks, "M  END") optionally followed by data items ("> <field>" then value lines), and
// records are separated by a line "$$$$" (CTfile Formats, BIOVIA/Dassault Systèmes, "SDfile").

export interface SdfRecord {
  /** 1-based position in the file. */
  record: number;
  /** The first header line (the molecule's title), trimmed; may be empty. */
  title: string;
  molfile: string;
  data: Record<string, string>;
}

export const SDF_RECORDS_MAX = 500;

export function splitSdf(text: string): SdfRecord[] {
  const normalised = text.replace(/\r\n?/g, '\n');
  const chunks = normalised.split(/^\$\$\$\$[ \t]*$/m);
  const out: SdfRecord[] = [];
  for (const chunk of chunks) {
    const body = chunk.replace(/^\n/, '');
    if (body.trim() === '') continue;
    const end = body.search(/^M {2}END[ \t]*$/m);
    const molfile = end < 0 ? body : body.slice(0, end) + 'M  END\n';
    const rest = end < 0 ? '' : body.slice(end).split('\n').slice(1).join('\n');
    out.push({ record: out.length + 1, title: body.split('\n')[0].trim(), molfile, data: dataItems(rest) });
  }
  return out;
}

function dataItems(text: string): Record<string, string> {
  const data: Record<string, string> = {};
  let field: string | null = null;
  let lines: string[] = [];
  const flush = () => {
    if (field !== null) data[field] = lines.join('\n').trim();
  };
  for (const line of text.split('\n')) {
    const header = /^>.*<([^>]+)>/.exec(line);
    if (header) {
      flush();
      field = header[1];
      lines = [];
    } else if (field !== null) lines.push(line);
  }
  flush();
  return data;
}

/** Whether text looks like a molfile or SD file at all (a V2000 or V3000 counts line and "M  END"). */
export function looksLikeMolfile(text: string): boolean {
  return /^M {2}END/m.test(text) && /(V2000|V3000)/.test(text);
}
