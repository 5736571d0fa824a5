'use client'

import Link from 'next/link'
import { useEffect, useState } from 'react'
import { ApiError } from '@/lib/api-client'
import type { ProjectSummary } from '@/lib/schemas/sewing-room'
import { fetchProjects } from '@/lib/sewing-room-client/api'
import { formatInches } from '@/lib/units'
import { PAPER_LABELS } from './paper-labels'
import { ProgressBar } from './progress-bar'

/** The quilter's projects, most recently worked on first, each with its progress and next step. */
export function ProjectList() {
  const [projects, setProjects] = useState<ProjectSummary[] | null>(null)
  const [problem, setProblem] = useState<string | null>(null)

  useEffect(() => {
    fetchProjects()
      .then(setProjects)
      .catch((error: unknown) => setProblem(error instanceof ApiError ? error.message : 'The server could not be reached.'))
  }, [])

  if (problem) return <p role="alert" className="text-madder-700">{problem}</p>
  if (!projects) return <p className="text-stone-600" aria-live="polite">Finding your projects…</p>
  if (projects.length === 0) return <p className="text-stone-700">No project yet. Start one from a pattern below.</p>
  return (
    <ul className="grid gap-3 sm:grid-cols-2" data-testid="projects">
      {projects.map((project) => {
        const finished = project.total > 0 && project.done === project.total
        return (
          <li key={project.id}>
            <Link
              href={`/sewing-room/${project.id}`}
              data-testid="project-card"
              className="block space-y-2 rounded-2xl border border-linen-200 bg-white p-4 hover:border-thread-600 hover:shadow-sm"
            >
              <span className="block text-lg leading-tight font-semibold text-thread-800">{project.name ?? project.patternName}</span>
              <span className="block text-sm text-stone-600">
                {project.name ? `${project.patternName} · ` : ''}
                {project.colorway.name ?? `Colourway ${project.colorway.index + 1}`} · {formatInches(project.diameterIn)} · {PAPER_LABELS[project.paper] ?? project.paper}
              </span>
              <ProgressBar progress={project} label={`${project.name ?? project.patternName}: progress`} />
              <span className="flex justify-between gap-2 text-sm">
                <span className="min-w-0 truncate text-stone-800">{finished ? 'Finished' : project.nextStepLabel ? `Next: ${project.nextStepLabel}` : ''}</span>
                <span className="shrink-0 text-stone-600 tabular-nums">
                  {project.done}/{project.total}
                </span>
              </span>
            </Link>
          </li>
        )
      })}
    </ul>
  )
}
