import type { ProjectDto } from '../../shared/schemas/project.schema';

/** An invented Kestrel Fen project for client specs: code KF-0001 for id 1, and so on. */
export const project = (id: number): ProjectDto => ({
  id,
  code: `KF-${String(id).padStart(4, '0')}`,
  name: `Kestrel Fen line ${id}`,
  client: 'Kestrel Fen Drives',
  description: '',
  revisionScheme: 'letters',
  status: 'active',
  createdAt: '2026-11-02T08:00:00Z',
  version: 1,
});
