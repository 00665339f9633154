// A small CSV reader after RFC 4180: fields separated by a delimiter, records by CRLF, LF or CR;
// a field in double quotes may hold delimiters, line breaks and doubled quotes (""). A leading
// byte-order mark is dropped; blank lines are skipped. Each record keeps the line number it
// starts on, so errors can point at the line a spreadsheet shows. Faults are reported, not thrown.

export interface CsvRecord {
  /** 1-based line number where the record starts. */
  line: number
  fields: string[]
}

export interface CsvError {
  line: number
  message: string
}

export type CsvDelimiter = ',' | ';' | '\t'

/** The delimiter of a file from its first line: the most frequent of , ; and tab outside quotes. */
export function detectCsvDelimiter(text: string): CsvDelimiter {
  const counts = { ',': 0, ';': 0, '\t': 0 }
  let quoted = false
  for (const ch of text.replace(/^\uFEFF/, '')) {
    if (ch === '"') quoted = !quoted
    else if (!quoted && (ch === '\n' || ch === '\r')) break
    else if (!quoted && ch in counts) counts[ch as CsvDelimiter]++
  }
  const [best, n] = Object.entries(counts).sort((a, b) => b[1] - a[1])[0]!
  return (n > 0 ? best : ',') as CsvDelimiter
}

export function parseCsv(text: string, delimiter: CsvDelimiter = detectCsvDelimiter(text)): { records: CsvRecord[]; errors: CsvError[] } {
  const src = text.replace(/^\uFEFF/, '')
  const records: CsvRecord[] = []
  const errors: CsvError[] = []
  let line = 1
  let start = 1
  let fields: string[] = []
  let field = ''
  let i = 0
  let broken = false
  const endRecord = () => {
    fields.push(field)
    if (!broken && !(fields.length === 1 && fields[0]!.trim() === '')) records.push({ line: start, fields })
    fields = []
    field = ''
    broken = false
  }
  while (i < src.length) {
    const ch = src[i]!
    if (ch === '"' && field.trim() === '') {
      // quoted field
      const open = line
      field = ''
      i++
      let closed = false
      while (i < src.length) {
        const c = src[i]!
        if (c === '"') {
          if (src[i + 1] === '"') {
            field += '"'
            i += 2
            continue
          }
          closed = true
          i++
          break
        }
        if (c === '\r' || c === '\n') line++
        const crlf = c === '\r' && src[i + 1] === '\n'
        field += crlf ? '\r\n' : c
        i += crlf ? 2 : 1
      }
      if (!closed) {
        errors.push({ line: open, message: `Line ${open}: a quoted field is never closed; end it with a double quote (")` })
        return { records, errors }
      }
      let junk = ''
      while (i < src.length && src[i] !== delimiter && src[i] !== '\n' && src[i] !== '\r') junk += src[i++]
      if (junk.trim()) {
        errors.push({ line: open, message: `Line ${open}: text after a closing quote (${JSON.stringify(junk.trim())}); put the whole field in quotes and write a quote inside it as ""` })
        broken = true
      }
      continue
    }
    if (ch === delimiter) {
      fields.push(field)
      field = ''
      i++
    } else if (ch === '\r' || ch === '\n') {
      endRecord()
      i += ch === '\r' && src[i + 1] === '\n' ? 2 : 1
      line++
      start = line
    } else {
      if (ch === '"' && !broken) {
        errors.push({ line, message: `Line ${line}: a quote inside an unquoted field; put the whole field in quotes and write the quote as ""` })
        broken = true
      }
      field += ch
      i++
    }
  }
  if (field !== '' || fields.length) endRecord()
  return { records, errors }
}
