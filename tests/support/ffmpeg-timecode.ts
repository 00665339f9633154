// The independent reference for SMPTE ST 12-1 labels in the tests: FFmpeg's libavutil/timecode.c
// (FFmpeg 6/7), its two functions av_timecode_adjust_ntsc_framenum2() and av_timecode_make_string()
// ported line by line (the AV_TIMECODE_FLAG_DROPFRAME and AV_TIMECODE_FLAG_24HOURSMAX paths). C
// integer division truncates toward zero, written here as Math.trunc.

/*
 * libavutil/timecode.c:
 *   int av_timecode_adjust_ntsc_framenum2(int framenum, int fps)
 *   {
 *       int drop_frames = 0, d, m, frames_per_10mins;
 *       if (fps && fps % 30 == 0) {
 *           drop_frames = fps / 30 * 2;
 *           frames_per_10mins = fps / 30 * 17982;
 *       } else
 *           return framenum;
 *       d = framenum / frames_per_10mins;
 *       m = framenum % frames_per_10mins;
 *       return framenum + 9U * drop_frames * d + drop_frames * ((m - drop_frames) / (frames_per_10mins / 10));
 *   }
 */
export function avTimecodeAdjustNtscFramenum2(framenum: number, fps: number): number {
  if (!(fps && fps % 30 === 0)) return framenum
  const dropFrames = Math.trunc(fps / 30) * 2
  const framesPer10Mins = Math.trunc(fps / 30) * 17982
  const d = Math.trunc(framenum / framesPer10Mins)
  const m = framenum % framesPer10Mins
  return framenum + 9 * dropFrames * d + dropFrames * Math.trunc((m - dropFrames) / Math.trunc(framesPer10Mins / 10))
}

/*
 * char *av_timecode_make_string(const AVTimecode *tc, char *buf, int framenum_arg)
 *   int fps = tc->fps; int drop = tc->flags & AV_TIMECODE_FLAG_DROPFRAME;
 *   framenum += tc->start;
 *   if (drop) framenum = av_timecode_adjust_ntsc_framenum2(framenum, fps);
 *   if (framenum < 0) { framenum = -framenum; neg = tc->flags & AV_TIMECODE_FLAG_ALLOWNEGATIVE; }
 *   ff = framenum % fps; ss = framenum / fps % 60; mm = framenum / (fps*60LL) % 60; hh = framenum / (fps*3600LL);
 *   if (tc->flags & AV_TIMECODE_FLAG_24HOURSMAX) hh = hh % 24;
 *   snprintf(buf, ..., "%s%02"PRId64":%02d:%02d%c%02d", neg ? "-" : "", hh, mm, ss, drop ? ';' : ':', ff);
 * `fps` is the rounded rate (av_timecode_init: 30 for 30000/1001) and `start` the start timecode's frames.
 */
export function avTimecodeMakeString(framenumArg: number, fps: number, drop: boolean, start = 0): string {
  let framenum = framenumArg + start
  if (drop) framenum = avTimecodeAdjustNtscFramenum2(framenum, fps)
  const ff = framenum % fps
  const ss = Math.trunc(framenum / fps) % 60
  const mm = Math.trunc(framenum / (fps * 60)) % 60
  const hh = Math.trunc(framenum / (fps * 3600)) % 24
  const p = (x: number) => String(x).padStart(2, '0')
  return `${p(hh)}:${p(mm)}:${p(ss)}${drop ? ';' : ':'}${p(ff)}`
}

/** av_timecode_init rounds the rate to whole labels a second: (fps.num + fps.den / 2) / fps.den. */
export const ROUNDED_FPS: Record<number, number> = { 23.976: 24, 24: 24, 25: 25, 29.97: 30, 30: 30, 50: 50, 59.94: 60, 60: 60 }
