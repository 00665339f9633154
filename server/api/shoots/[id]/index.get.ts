// The shoot's snapshot: the same object `shoot:join` acknowledges with.
import { Shoot } from '../../../db/models'

export default defineEventHandler(async (event) => {
  const caller = await requireShoot(event, 'shoot.read')
  const row = await Shoot.findByPk(caller.shootId, { attributes: ['id', 'state', 'title', 'mode', 'status', 'studioId'] })
  // A shoot row without a run order (made before the engine) is described without state.
  if (!row!.state) return { id: row!.id, studioId: row!.studioId, title: row!.title, mode: row!.mode, status: row!.status, you: { kind: caller.kind, role: caller.role } }
  const snapshot = await shootSnapshot(caller.shootId, caller)
  return { ...snapshot, id: row!.id, title: row!.title, mode: row!.mode, status: snapshot.state.status, you: { ...snapshot.you, kind: caller.kind, role: caller.role } }
})
