// The shoot as far as it exists yet; the live shoot engine extends this to the full snapshot.
import { Shoot } from '../../../db/models'

export default defineEventHandler(async (event) => {
  const { shootId, role, kind } = await requireShoot(event, 'shoot.read')
  const shoot = await Shoot.findByPk(shootId)
  return { id: shoot!.id, studioId: shoot!.studioId, title: shoot!.title, mode: shoot!.mode, status: shoot!.status, you: { kind, role } }
})
