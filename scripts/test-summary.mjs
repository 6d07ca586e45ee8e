// Adds up the steps and vitest projects of one `npm test` run and prints the closing line.
import { readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'

const [results, seconds, projects = 'unit server e2e'] = process.argv.slice(2)
let passed = 0
let failed = 0
let skipped = 0
const failures = []
for (const name of readdirSync(results).sort()) {
  const path = join(results, name)
  if (name.startsWith('step-')) {
    if (readFileSync(path, 'utf8').trim() === 'pass') passed++
    else { failed++; failures.push(name.slice(5)) }
  }
  else if (name.startsWith('vitest-') && name.endsWith('.json')) {
    const report = JSON.parse(readFileSync(path, 'utf8'))
    passed += report.numPassedTests
    failed += report.numFailedTests
    skipped += report.numPendingTests + (report.numTodoTests ?? 0)
    // A file that fails to load, or whose set-up fails, may have no failed test to count; it still fails the run.
    const brokenFiles = report.testResults.filter(f => f.status === 'failed' && !f.assertionResults.some(a => a.status === 'failed'))
    failed += brokenFiles.length
    if (report.numFailedTests > 0 || brokenFiles.length > 0) failures.push(name.slice(7, -5))
  }
}
for (const project of projects.split(/\s+/).filter(Boolean)) {
  // A project that never reported (crashed, or never started) is a failure, not silence.
  if (!readdirSync(results).includes(`vitest-${project}.json`)) { failed++; failures.push(`${project} (no report)`) }
}
if (failures.length) console.log(`failing: ${failures.join(', ')}`)
console.log(`wall time: ${seconds}s`)
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`)
process.exit(failed > 0 ? 1 : 0)
