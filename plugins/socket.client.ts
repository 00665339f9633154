// The one socket of the app: socket.io to the same origin, opened by the shoot store when a shoot
// screen opens it (autoConnect off), with the session cookie. Listeners are bound in the store
// (stores/shoot.ts), never in components.
import { io, type Socket } from 'socket.io-client'
import type { ClientToServerEvents, ServerToClientEvents } from '~~/shared/types/socket-events'

export type ShootSocket = Socket<ServerToClientEvents, ClientToServerEvents>

export default defineNuxtPlugin(() => {
  const socket: ShootSocket = io({
    path: '/socket.io',
    autoConnect: false,
    withCredentials: true,
    // A dropped Wi-Fi on set should be back within seconds, not after a long back-off.
    reconnectionDelay: 500,
    reconnectionDelayMax: 3000,
  })
  return { provide: { socket } }
})
