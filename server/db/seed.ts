// Demo data: an invented studio, its crew (one account per role), its dishes and shop prices. Runs in one transaction and only
// on an empty database, so running it twice, or killing it half-way, never leaves half a studio.
import type { Sequelize } from 'sequelize'
import { DEMO_PASSWORD, demoCrew, demoStudio } from './demo'
import { Membership, Studio, User } from './models'
import { seedDemoRecipes } from './seed-recipes'
import { DEMO_HOST_WPM } from './demo-show'
import type { DemoPhotoName } from './demo-photos'

export interface SeedResult {
  seeded: boolean
  studio: string
}

export type PasswordHasher = (password: string) => Promise<string>
/** Stores a demo photo for a recipe and returns its storage key (server/utils/photos.ts). */
export type DemoPhotoStore = (name: DemoPhotoName, studioId: number, recipeId: number) => Promise<string>

export async function isEmpty(): Promise<boolean> {
  return (await Studio.count()) === 0
}

export async function seedDemo(sequelize: Sequelize, hashPassword: PasswordHasher, storePhoto?: DemoPhotoStore): Promise<SeedResult> {
  const passwordHash = await hashPassword(DEMO_PASSWORD)
  return sequelize.transaction(async () => {
    if ((await Studio.count()) > 0) return { seeded: false, studio: demoStudio.name }
    const studio = await Studio.create({ ...demoStudio })
    let hostId: number | null = null
    for (const person of demoCrew) {
      const user = await User.create({ name: person.name, email: person.email, passwordHash })
      const host = person.role === 'host'
      await Membership.create({ userId: user.id, studioId: studio.id, role: person.role, readingWpm: host ? DEMO_HOST_WPM : null })
      if (host) hostId = user.id
    }
    const recipes = await seedDemoRecipes(studio.id, studio.currency, hostId)
    if (storePhoto) {
      for (const { recipe, photo } of recipes) await recipe.update({ photo: await storePhoto(photo, studio.id, recipe.id) })
    }
    return { seeded: true, studio: demoStudio.name }
  })
}
