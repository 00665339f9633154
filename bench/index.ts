// Every benchmark `npm run bench` runs, in order. Add new ones here.
import { campaign } from './campaign.bench'
import { databaseCommit } from './database.bench'
import { planBenchmarks } from './plan.bench'
import { shootBenchmarks } from './shoot.bench'
import { screenBenchmarks } from './screens.bench'
import type { Benchmark } from './types'

export const benchmarks: Benchmark[] = [databaseCommit, ...planBenchmarks, ...shootBenchmarks, ...screenBenchmarks, campaign]
