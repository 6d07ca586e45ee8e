// Benchmark of the LaTeX reader: a synthetic 100-page manuscript (about 3,000 characters
// per page) holding 1,000 claims of every recognised kind, spread over a main file and
// ten section files. Goal: extraction under 1 s. Run: npx tsx scripts/bench-reader.ts
// A binding holds to the end of its paragraph, so the claims about w bind it in their own.
import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { readManuscript } from '../shared/latex/index'

const CLAIM_TEMPLATES = [
  '$\\Sch{2143} = x_1^2 + x_1 x_2 + x_1 x_3$',
  '\\begin{align}\n\\mathfrak S_{132}(x;y) &= x_1 + x_2 - y_1 - y_2 \\\\\n &= (x_1 - y_1) + (x_2 - y_2)\n\\end{align}',
  '\\[ s_{21} s_{1} = s_{31} + s_{22} + s_{211} \\]',
  'Let $w = 25143$. Then $\\ell(w) = 4$',
  'For $w = 25143$, $\\#\\BPD(w) = 2$',
  '$c^{321}_{21,21} = 2$',
  '$K_{(3,1),(2,1,1)} = 2$',
  '$\\partial_1 \\mathfrak S_{231} = \\mathfrak S_{213}$',
  '\\begin{equation}\\det\\begin{pmatrix} h_1 & h_2 \\\\ 1 & h_1 \\end{pmatrix} = s_{11}\\end{equation}',
  '$\\mathfrak S_{w_0^{(4)}}(1,\\dots,1) = 1$',
]
const PROSE = 'We study the combinatorics of the polynomials above and compare the expansions term by term, '
  + 'noting how each monomial arises from a diagram drawn in the staircase. '

function section(k: number, claimsWanted: number): string {
  let out = `\\section{Part ${k}}\nLet $w = 25143$.\n`
  let claims = 0
  let t = k
  while (claims < claimsWanted) {
    let template = CLAIM_TEMPLATES[t++ % CLAIM_TEMPLATES.length]!
    if (template.includes('&=') && claims + 2 > claimsWanted) template = CLAIM_TEMPLATES[0]!
    const count = template.includes('&=') ? 2 : 1
    out += PROSE + '\n' + template + '\n' + PROSE + '\n\n'
    claims += count
  }
  return out
}

const files: Record<string, string> = {
  'main.tex': [
    '\\documentclass{amsart}',
    '\\newcommand{\\Sch}[2][x]{\\mathfrak{S}_{#2}(#1)}',
    '\\DeclareMathOperator{\\BPD}{BPD}',
    '\\begin{document}',
    ...Array.from({ length: 10 }, (_, k) => `\\input{sections/part${k}}`),
    '\\end{document}',
  ].join('\n'),
}
for (let k = 0; k < 10; k++) files[`sections/part${k}.tex`] = section(k, 100)
const chars = Object.values(files).reduce((s, f) => s + f.length, 0)

const cold = performance.now()
const first = readManuscript({ files }) // cold run (includes JIT warm-up), and the figures below
const coldMs = performance.now() - cold
const runs = 9
const times: number[] = []
for (let i = 0; i < runs; i++) {
  const t = performance.now()
  readManuscript({ files })
  times.push(performance.now() - t)
}
times.sort((a, b) => a - b)
const median = times[Math.floor(runs / 2)]!
const ready = first.claims.filter(c => c.status === 'ready').length
console.log(`input: ${(chars / 1024).toFixed(0)} KiB in ${Object.keys(files).length} files (≈ ${Math.round(chars / 3000)} pages)`)
console.log(`claims: ${first.claims.length} (${ready} ready), warnings: ${first.warnings.length}`)
console.log(`extraction: median ${median.toFixed(0)} ms over ${runs} runs (min ${times[0]!.toFixed(0)} ms) — goal < 1000 ms: ${median < 1000 ? 'met' : 'NOT met'}`)
console.log(`first (cold) run: ${coldMs.toFixed(0)} ms`)
console.log(`throughput: ${((chars / 1024 / 1024) / (median / 1000)).toFixed(1)} MiB/s, ${Math.round(first.claims.length / (median / 1000))} claims/s`)

// Second case: a 250 KB paper, built from the styles corpus's long paper (tests/fixtures/styles/long-paper)
// by repeating its sections with fresh labels until it holds 250 KiB. Goal: read in under 1 s.
const longPaper = readFileSync(join(import.meta.dirname, '../tests/fixtures/styles/long-paper/paper.tex'), 'utf8')
const bodyStart = longPaper.indexOf('\\begin{document}') + '\\begin{document}'.length
const bodyEnd = longPaper.indexOf('\\end{document}')
const preamble = longPaper.slice(0, bodyStart)
const body = longPaper.slice(bodyStart, bodyEnd)
// Section by section, so that the paper stops just past 250 KiB (the long paper alone is about 240 KiB).
const sections = body.split(/(?=\\section\{)/)
let big = preamble
for (let copy = 0; big.length < 250 * 1024; copy++) {
  for (const section of sections) {
    if (big.length >= 250 * 1024) break
    big += section.replace(/\\(label|ref)\{([^}]*)\}/g, (_, command, name) => `\\${command}{${name}-copy${copy}}`)
  }
}
big += '\\end{document}\n'
const bigFiles = { 'paper.tex': big }
readManuscript({ files: bigFiles }) // warm-up
const bigTimes: number[] = []
let bigClaims = 0
for (let i = 0; i < 5; i++) {
  const t = performance.now()
  bigClaims = readManuscript({ files: bigFiles }).claims.length
  bigTimes.push(performance.now() - t)
}
bigTimes.sort((a, b) => a - b)
const bigMedian = bigTimes[2]!
console.log(`250 KB paper: ${(big.length / 1024).toFixed(0)} KiB, ${big.split('\n').length} lines, ${bigClaims} claims; read in median ${bigMedian.toFixed(0)} ms over 5 runs (min ${bigTimes[0]!.toFixed(0)} ms) — goal < 1000 ms: ${bigMedian < 1000 ? 'met' : 'NOT met'}`)
