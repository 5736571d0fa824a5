import { readFileSync } from 'node:fs'
import { join } from 'node:path'
import { describe, expect, it } from 'vitest'
import { PROBLEM_CODES } from './types'

/** The backticked codes of one line of the README's code list ("  - errors: …"). */
function readmeCodes(kind: 'errors' | 'warnings'): string[] {
  const readme = readFileSync(join(import.meta.dirname, 'README.md'), 'utf8')
  const list = readme.slice(readme.indexOf('Codes (`ProblemCode`'))
  const start = list.indexOf(`  - ${kind}:`)
  const end = list.indexOf(kind === 'errors' ? '  - warnings:' : '\n  Inserts never')
  // Only the codes themselves: parentheses explain, they never name another code.
  const text = list.slice(start, end).replace(/\([^)]*\)/g, '')
  return [...text.matchAll(/`([a-z-]+)`/g)].map((match) => match[1]!)
}

describe('problem codes', () => {
  it('lists in the README exactly the codes the type allows, errors then warnings', () => {
    expect([...readmeCodes('errors'), ...readmeCodes('warnings')]).toEqual([...PROBLEM_CODES])
  })
})
