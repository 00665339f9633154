// Types of webvtt-parser 2.2.0 (it ships none): the parts the take-log tests read.
declare module 'webvtt-parser' {
  export interface WebVTTCue { id: string; startTime: number; endTime: number; text: string }
  export interface WebVTTParseError { message: string; line: number; col: number }
  export class WebVTTParser {
    parse(input: string, mode?: 'metadata' | 'chapters'): { cues: WebVTTCue[]; errors: WebVTTParseError[] }
  }
}
