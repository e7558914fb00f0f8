import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // Named specs a team starts studies from; the spec is the engine contract's spec object.
  await knex.schema.createTable('spec_templates', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.string('name', 120).notNullable()
    t.text('description').nullable()
    t.json('spec').notNullable()
    t.boolean('is_demo').notNullable().defaultTo(false)
    t.integer('version').unsigned().notNullable().defaultTo(1)
    t.timestamps(true, true)
    t.unique(['team_id', 'name'])
  })
  // The engine may size the unit resistor itself (unitOhm "auto"): stored as NULL.
  await knex.schema.alterTable('process_presets', (t) => {
    t.double('unit_ohm').nullable().alter()
  })
}

export async function down(knex: Knex): Promise<void> {
  // An "auto" unit resistor has no value in the old schema; 0 marks it as needing one.
  await knex('process_presets').whereNull('unit_ohm').update({ unit_ohm: 0 })
  await knex.schema.alterTable('process_presets', (t) => {
    t.double('unit_ohm').notNullable().alter()
  })
  await knex.schema.dropTable('spec_templates')
}
