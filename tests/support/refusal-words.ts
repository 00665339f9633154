// Whether a refusal's message is in a crew's words (DEVELOPERS.md, "Errors"): no request key in
// front ("email: …", "body: …"), no dotted path ("steps.2.durationMin"), no camelCase or snake_case
// identifier, no route parameter or table name, none of zod's or JavaScript's own wording. What the
// message quotes ("…" or “…”) is what the person wrote, and addresses (e-mail, web, a domain such
// as schema.org) are shown on purpose: both are taken out before the check.

/** Words a message may show that look like identifiers: standards and headers people are told to send. */
const SHOWN = [
  /\b[\w.+-]+@[\w-]+(\.[\w-]+)+/g, // e-mail addresses
  /\bhttps?:\/\/\S+/g, // web addresses
  /\b(schema\.org|example\.(com|org|test)|zod\.dev)\b/g, // domains named as such
  /\b(e\.g\.|i\.e\.)/g,
  /\.(jsonld|json|html|csv|jpe?g|png|webp)\b/g, // file name endings
]

/** Identifiers of the code that a person should never read. */
const INTERNAL = [
  // Route parameters, request keys and programmer words that have no camel hump to catch.
  /\b(studioId|shootId|recipeId|recipeIds|priceId|userId|inviteId|mailId|codeId|stepId|timerId|markerId|nowServerMs)\b/,
  /\b(undefined|NaN|null)\b/, /\[object Object\]/,
  // zod's own wording.
  /\bInvalid (input|option|string|email|type)\b/i, /\bexpected \w+, received \w+/i, /\bToo (big|small):/, /\bZod\w*/,
  // JavaScript, JSON.parse and the database.
  /\bUnexpected token\b/, /\bCannot read propert/, /\bis not a function\b/, /\bSQLITE_\w+/, /\bSequelize\w*/, /\bconstraint failed\b/,
  /\b(TypeError|RangeError|SyntaxError)\b/,
]

/** The message with the person's own text and the addresses it shows taken out. */
export function wordsOnly(message: string): string {
  let rest = message.replace(/"[^"]*"|“[^”]*”|‘[^’]*’/g, ' ')
  for (const re of SHOWN) rest = rest.replace(re, ' ')
  return rest
}

/** What is wrong with a refusal's wording, or null when it reads as a person's words. */
export function wordsProblem(message: string): string | null {
  const prefix = /^([a-z][\w.]*|[a-z]+[A-Z]\w*):/.exec(message)
  if (prefix) return `starts with the request key "${prefix[1]}"`
  const rest = wordsOnly(message)
  const dotted = /\b[a-z]+(\.[a-zA-Z0-9]+)+\b/.exec(rest)
  if (dotted) return `names the dotted path "${dotted[0]}"`
  const camel = /\b[a-z]{2,}[A-Z][a-zA-Z0-9]*\b/.exec(rest)
  if (camel) return `names the identifier "${camel[0]}"`
  const snake = /\b[a-z]+_[a-z_]+\b/.exec(rest)
  if (snake) return `names the identifier "${snake[0]}"`
  for (const re of INTERNAL) {
    const m = re.exec(rest)
    if (m) return `uses the internal word "${m[0]}"`
  }
  return null
}
