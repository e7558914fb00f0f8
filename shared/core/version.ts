/** Version of the computation engine, reported in every evaluate output (bump on any model change). */
export const ENGINE_VERSION = '0.1.0'
