import { evaluateSpec, parseEvaluateInput } from '../../shared/core/evaluate'
for (const bits of [10, 12, 16]) {
  const input = parseEvaluateInput({ spec: { bits, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 1e-11, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, areaBudgetMm2: 0.05, glitchLimitVs: 1e-10, powerBudgetW: 1e-3 }, process: { sheetOhmPerSq: 1000, matchingPctUm: 1, matchingConvention: 'pair' }, options: { trials: 250, seed: 1 } })
  const t0 = performance.now(); const out = evaluateSpec(input); const t1 = performance.now(); const s = JSON.stringify(out); const t2 = performance.now()
  console.log(bits, 'bits:', (s.length / 1e6).toFixed(2), 'MB; eval', (t1 - t0).toFixed(0), 'ms; stringify', (t2 - t1).toFixed(0), 'ms')
}
