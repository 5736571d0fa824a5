import type { ProjectSummary } from '@/lib/schemas/sewing-room'

/** A project as the list and the plan show it, for tests of what is drawn from it. */
export function projectSummary(overrides: Partial<ProjectSummary> = {}): ProjectSummary {
  return {
    id: '6f1c2b3a-0000-4000-8000-000000000001',
    name: null,
    patternId: '6f1c2b3a-0000-4000-8000-000000000002',
    patternName: 'A ring',
    designerName: 'Someone',
    colorway: { index: 0, name: null },
    diameterIn: 18,
    paper: 'letter',
    licenceId: null,
    invitationId: null,
    done: 0,
    total: 0,
    nextStepLabel: null,
    createdAt: '2026-12-01T09:00:00.000Z',
    updatedAt: '2026-12-03T10:00:00.000Z',
    ...overrides,
  }
}
