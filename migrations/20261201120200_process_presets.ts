import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // Column names follow the engine contract's process fields (snake_case of sheetOhmPerSq, …).
  await knex.schema.createTable('process_presets', (t) => {
    t.increments('id').primary()
    t.integer('team_id').unsigned().notNullable().references('teams.id').onDelete('CASCADE')
    t.string('name', 120).notNullable()
    t.text('description').nullable()
    t.double('sheet_ohm_per_sq').notNullable()
    t.double('matching_pct_um').notNullable()
    t.enum('matching_convention', ['pair', 'single']).notNullable()
    t.double('unit_ohm').notNullable()
    t.double('switch_ohm').notNullable()
    t.double('switch_skew_s').notNullable()
    t.double('switch_charge_c').notNullable()
    t.double('switch_area_um2').notNullable()
    t.double('gate_area_um2').notNullable()
    t.double('layout_overhead').notNullable()
    t.double('min_width_um').notNullable()
    t.double('min_length_um').notNullable()
    t.boolean('is_demo').notNullable().defaultTo(false)
    t.integer('version').unsigned().notNullable().defaultTo(1)
    t.timestamps(true, true)
    t.unique(['team_id', 'name'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('process_presets')
}
