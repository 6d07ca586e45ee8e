// Benchmark of the LaTeX reader: a synthetic 100-page manuscript (about 3,000 characters
// per page) holding 1,000 claims of every recognised kind, spread over a main file and
// ten section files. Goal: extraction under 1 s. Run: npx tsx scripts/bench-reader.ts
// A binding holds to the end of its paragraph, so the claims about w bind it in their own.
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
