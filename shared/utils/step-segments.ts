// The plain text of a step's rendered segments (step-text.ts renders them). Its own small module so
// the shoot screens can use it without the scaling code.
export function segmentsText(segments: ReadonlyArray<{ text: string }>): string {
  return segments.map((s) => s.text).join('')
}
