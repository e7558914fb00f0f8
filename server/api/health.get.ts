export interface HealthReport {
  app: 'ok'
  database: 'ok' | 'unavailable'
  time: string
}

export default defineEventHandler(async (event): Promise<HealthReport> => {
  let database: HealthReport['database'] = 'ok'
  try {
    await useDb().raw('select 1')
  } catch {
    database = 'unavailable'
  }
  if (database !== 'ok') setResponseStatus(event, 503, 'Database unavailable')
  return { app: 'ok', database, time: new Date().toISOString() }
})
