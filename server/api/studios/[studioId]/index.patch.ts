// Studio settings: name, locale and currency, the budget per serving, the cup and unit system.
export default defineEventHandler(async (event) => {
  const { studioId } = await requireStudio(event, 'crew.manage')
  const body = await validateBody(event, studioSettingsSchema, STUDIO_SETTINGS_LABELS)
  return updateStudioSettings(studioId, body)
})
