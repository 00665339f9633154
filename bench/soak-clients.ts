// What the soak (bench/soak.ts) and its baselines share: its shape, socket.io clients on loopback,
// the pacing of commands, and the server's memory and CPU read from /proc (proc(5)).
import { readFileSync } from 'node:fs'
import { io as connect, type Socket } from 'socket.io-client'

export interface SoakShape {
  /** Shoots (rooms), screens on each, commands a second in total, seconds of commands. */
  shoots: number
  screens: number
  rate: number
  seconds: number
}

export function openSocket(url: string, cookie?: string): Promise<Socket> {
  const socket = connect(url, { transports: ['websocket'], extraHeaders: cookie ? { cookie } : {}, forceNew: true, reconnection: false })
  return new Promise((resolve, reject) => {
    socket.once('connect', () => resolve(socket))
    socket.once('connect_error', reject)
  })
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, Math.max(0, ms)))

/**
 * Sends `rate` commands a second in total for `seconds`, spread evenly over the shoots: shoot g
 * sends its n-th at start + g·(1/rate) + n·(shoots/rate). A shoot's commands go one after another
 * (the next waits for the answer to the one before, as a screen's button does); a late answer
 * delays that shoot's next command, which shows in the achieved rate; what is still unsent a
 * tenth of the run (at least 5 s) after the end is left unsent.
 */
export async function paced(shape: SoakShape, seconds: number, send: (g: number, n: number) => Promise<void>): Promise<{ sent: number; planned: number }> {
  const period = (shape.shoots / shape.rate) * 1000
  const start = performance.now() + 100
  const end = start + seconds * 1000
  // Bounded in time: a server that falls behind has its late commands left unsent (and counted) once this is past.
  const giveUp = end + Math.max(5000, seconds * 100)
  let sent = 0
  let planned = 0
  await Promise.all(Array.from({ length: shape.shoots }, async (_, g) => {
    for (let n = 0; ; n++) {
      const at = start + (g * 1000) / shape.rate + n * period
      if (at >= end) break
      planned++
      if (performance.now() > giveUp) continue
      await sleep(at - performance.now())
      await send(g, n)
      sent++
    }
  }))
  return { sent, planned }
}

/** Samples a process's resident memory (VmRSS) and CPU time every `everyMs` until stopped. */
export function sampleProcess(pid: number, everyMs = 500) {
  const ticks = 100 // USER_HZ on Linux (sysconf(_SC_CLK_TCK)); /proc/<pid>/stat counts CPU time in these
  const read = () => {
    const status = readFileSync(`/proc/${pid}/status`, 'utf8')
    const rssKb = Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0)
    // Fields after the command name's closing parenthesis: utime and stime are the 12th and 13th.
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8')
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ')
    return { rssMb: rssKb / 1024, cpuSeconds: (Number(fields[11]) + Number(fields[12])) / ticks, at: performance.now() }
  }
  const first = read()
  let last = first
  let peakRssMb = first.rssMb
  let peakCpu = 0
  const timer = setInterval(() => {
    try {
      const now = read()
      peakRssMb = Math.max(peakRssMb, now.rssMb)
      peakCpu = Math.max(peakCpu, ((now.cpuSeconds - last.cpuSeconds) * 1000) / (now.at - last.at))
      last = now
    } catch {
      // The process has gone; the figures so far stand.
    }
  }, everyMs)
  return {
    /** Peak RSS (MB), mean and peak CPU (1 = one core) since the start. */
    stop() {
      clearInterval(timer)
      const meanCpu = ((last.cpuSeconds - first.cpuSeconds) * 1000) / Math.max(1, last.at - first.at)
      return { peakRssMb, meanCpu, peakCpu }
    },
  }
}
