// The live shoot's server clock: wall-clock ms that advance on the monotonic clock only
// (shared/utils/steady-clock.ts says why). Every shoot time the server stamps (commands, deadlines,
// due timers, snapshots, clock-sync pings) is read here, so a step of the machine's clock does not
// move a running timer.
import { performance } from 'node:perf_hooks'
import { steadyClock } from '../../shared/utils/steady-clock'

export const shootServerNow = steadyClock(Date.now, () => performance.now())
