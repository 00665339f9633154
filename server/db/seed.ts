// Demo data: an invented studio. Runs in one transaction and only on an empty database, so running it
// twice, or killing it half-way, never leaves a half-seeded studio behind.
import type { Sequelize } from 'sequelize'
import { demoStudio } from './demo'
import { Studio } from './models'

export interface SeedResult {
  seeded: boolean
  studio: string
}

export async function isEmpty(): Promise<boolean> {
  return (await Studio.count()) === 0
}

export async function seedDemo(sequelize: Sequelize): Promise<SeedResult> {
  return sequelize.transaction(async (transaction) => {
    if ((await Studio.count({ transaction })) > 0) return { seeded: false, studio: demoStudio.name }
    await Studio.create({ ...demoStudio }, { transaction })
    return { seeded: true, studio: demoStudio.name }
  })
}
