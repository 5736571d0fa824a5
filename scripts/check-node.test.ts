/**
 * bootstrap.sh refuses a Node.js outside package.json's "engines" with one line and exit code 2
 * (scripts/check-node.sh). A stand-in `node` first on PATH reports each version.
 */
import { spawnSync } from 'node:child_process'
import { chmodSync, mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { describe, expect, it } from 'vitest'

const projectRoot = path.resolve(import.meta.dirname, '..')

function checkWith(nodeScript: string) {
  const bin = mkdtempSync(path.join(tmpdir(), 'wreathwright-node-'))
  writeFileSync(path.join(bin, 'node'), `#!/bin/sh\n${nodeScript}\n`)
  chmodSync(path.join(bin, 'node'), 0o755)
  return spawnSync('bash', ['scripts/check-node.sh'], {
    cwd: projectRoot,
    encoding: 'utf8',
    env: { ...process.env, PATH: `${bin}:${process.env.PATH}` },
  })
}

describe('the Node.js version check', () => {
  it('follows the engines range of package.json', () => {
    // If this fails, "engines" changed: update check-node.sh and the versions below with it.
    expect(JSON.parse(readFileSync(path.join(projectRoot, 'package.json'), 'utf8')).engines.node).toBe('>=20.19 <21 || >=22')
  })

  for (const version of ['20.19.0', '20.20.2', '22.0.0', '24.3.1']) {
    it(`accepts Node.js ${version}`, () => {
      const result = checkWith(`echo ${version}`)
      expect(result.status).toBe(0)
      expect(result.stderr).toBe('')
    })
  }

  for (const version of ['18.20.4', '20.18.3', '21.7.3', '19.9.0']) {
    it(`refuses Node.js ${version} in one line with exit code 2`, () => {
      const result = checkWith(`echo ${version}`)
      expect(result.status).toBe(2)
      expect(result.stderr.trim().split('\n')).toEqual([
        `bootstrap: Node.js ${version} is not supported; Wreathwright needs Node.js 20.19 or a later 20.x, or 22 or later (package.json engines)`,
      ])
    })
  }

  it('says so in one line when node does not run', () => {
    const result = checkWith('exit 127')
    expect(result.status).toBe(2)
    expect(result.stderr.trim().split('\n')).toEqual(['bootstrap: Node.js is not installed; Wreathwright needs Node.js 20.19 or a later 20.x, or 22 or later'])
  })
})
