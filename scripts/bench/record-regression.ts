/**
 * Records the evaluate output of every REGRESSION_CASES request into the unit-test fixture.
 * Run it only on the reference code path (see regression-cases.ts).
 */
import { writeFileSync } from 'node:fs'
import { gzipSync } from 'node:zlib'
import { evaluateSpec, parseEvaluateInput } from '../../shared/core/evaluate'
import { REGRESSION_CASES } from '../../tests/unit/shared/core/fixtures/regression-cases'

const FIXTURE = new URL('../../tests/unit/shared/core/fixtures/evaluate-regression.json.gz', import.meta.url)

const recorded = Object.fromEntries(Object.entries(REGRESSION_CASES).map(([name, raw]) => [name, evaluateSpec(parseEvaluateInput(raw))]))
writeFileSync(FIXTURE, gzipSync(JSON.stringify(recorded), { level: 9 }))
process.stdout.write(`recorded ${Object.keys(recorded).length} cases\n`)
