// The named lists a studio's language, currency and time zone are chosen from
// (shared/utils/place-choices.ts, shared/utils/time-zone.ts). Named by the server's Intl data and sent
// with the page, so the browser draws the same lists: its own Intl data may name or list them
// differently, and the page would not hydrate. A value already chosen stays in its list.
import { currencyChoices, localeChoices, type Choice } from '~~/shared/utils/place-choices'
import { timeZoneChoices } from '~~/shared/utils/time-zone'

export function usePlaceChoices(form: { locale: string; currency: string; timeZone: string }) {
  const lists = useState('place-choices', () => ({ locales: localeChoices(''), currencies: currencyChoices(''), zones: timeZoneChoices('') }))
  const keep = (list: Choice[], v: string) => (!v || list.some((o) => o.value === v) ? list : [...list, { value: v, label: v }])
  // Known only in the browser: the zone this device is set to.
  const mounted = useMounted()
  const deviceZone = computed(() => (mounted.value ? Intl.DateTimeFormat().resolvedOptions().timeZone : ''))
  return {
    locales: computed(() => keep(lists.value.locales, form.locale)),
    currencies: computed(() => keep(lists.value.currencies, form.currency)),
    timeZones: computed(() => keep(lists.value.zones, form.timeZone)),
    deviceZone,
  }
}
