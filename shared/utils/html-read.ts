// Reading HTML in one pass: htmlparser2's tokenizer (WHATWG-style states, script and style read as
// raw text, character references decoded by the `entities` package). Not htmlparser2's Parser: its
// element stack (Array.unshift, indexOf) takes time growing with the square of the nesting depth,
// so 170,000 unclosed <a> tags held it for 2.2 s. Nothing here keeps a stack.
import { Tokenizer } from 'htmlparser2'

export interface HtmlReader {
  /** A start tag, its name in lower case and its attributes (the first of a repeated name wins). */
  open?(name: string, attribs: ReadonlyMap<string, string>): void
  /** An end tag, also right after a void or self-closing start tag. */
  close?(name: string): void
  /** Text, with character references decoded (a script's text is raw: none are decoded there). */
  text?(text: string): void
  /** The tags whose attributes `open` needs; others get an empty map (saves work on tag soup). */
  attributesOf?: ReadonlySet<string>
}

const NONE: ReadonlyMap<string, string> = new Map()

const VOID = new Set(['area', 'base', 'br', 'col', 'embed', 'hr', 'img', 'input', 'link', 'meta', 'source', 'track', 'wbr'])

/** Reads `html` from start to end, calling `reader` for each start tag, end tag and piece of text. */
export function readHtml(html: string, reader: HtmlReader): void {
  let tag = ''
  let attribs: Map<string, string> | null = null
  let name = ''
  let value = ''
  const ignore = () => {}
  const tokenizer = new Tokenizer({ decodeEntities: true }, {
    ontext: (start, end) => reader.text?.(html.slice(start, end)),
    ontextentity: (codepoint) => reader.text?.(String.fromCodePoint(codepoint)),
    onopentagname: (start, end) => {
      tag = html.slice(start, end).toLowerCase()
      attribs = reader.attributesOf?.has(tag) ? new Map() : null
    },
    onattribname: (start, end) => {
      if (!attribs) return
      name = html.slice(start, end).toLowerCase()
      value = ''
    },
    onattribdata: (start, end) => void (attribs && (value += html.slice(start, end))),
    onattribentity: (codepoint) => void (attribs && (value += String.fromCodePoint(codepoint))),
    onattribend: () => void (attribs && !attribs.has(name) && attribs.set(name, value)),
    onopentagend: () => {
      reader.open?.(tag, attribs ?? NONE)
      if (VOID.has(tag)) reader.close?.(tag)
    },
    onselfclosingtag: () => {
      reader.open?.(tag, attribs ?? NONE)
      reader.close?.(tag)
    },
    onclosetag: (start, end) => reader.close?.(html.slice(start, end).toLowerCase()),
    oncdata: ignore,
    oncomment: ignore,
    ondeclaration: ignore,
    onprocessinginstruction: ignore,
    onend: ignore,
  })
  tokenizer.write(html)
  tokenizer.end()
}
