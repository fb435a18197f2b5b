// Everything the shop page and the build sheet show for one version, gathered in one place so the
// page, the PDF and the approval e-mail's attachment read the same thing.
import { flowSplit, procedureFor, volumeByPart } from '#shared/shop'
import type { ShopView } from '#shared/schemas/shop'
import type { Database } from './db'

type Executor = Database | Parameters<Parameters<Database['transaction']>[0]>[0]

export async function shopViewFor(db: Executor, workshopId: string, circuitId: string, version: number, mayRecord: boolean): Promise<ShopView> {
  const v = await loadShopVersion(db, workshopId, circuitId, version)
  const [project, lineRows, recordRows, review, versions, reviewStatus] = await Promise.all([
    findProject(db, workshopId, v.circuit.projectId),
    shopLineRows(db, workshopId, circuitId, version),
    shopRecordRows(db, workshopId, circuitId, version),
    versionReview(db, workshopId, v),
    shopVersionList(db, workshopId, circuitId),
    reviewStatusOf(db, workshopId, v.circuit),
  ])
  const people = await peopleByIds(db, [
    v.savedBy, ...lineRows.flatMap((r) => [r.boughtBy, r.fittedBy]), ...recordPeopleIds(recordRows),
  ])
  const list = listWithTicks(listFor(v, lineRows), lineRows, people)
  return {
    circuit: { id: v.circuit.id, title: v.circuit.title, kind: v.circuit.kind, projectId: v.circuit.projectId, currentVersion: v.circuit.version },
    project: { id: project.id, title: project.title },
    version,
    savedAt: v.savedAt.toISOString(),
    savedBy: v.savedBy ? people.get(v.savedBy) ?? null : null,
    engineVersion: v.report.engineVersion,
    approval: review.approval,
    reviewStatus,
    versions,
    document: v.document,
    list,
    procedure: procedureFor(v.document, v.report),
    ...shopRecordsView(recordRows, people),
    estimateL: v.report.quantities.volume.totalL,
    charts: { volumeByPart: volumeByPart(v.report), flowSplit: flowSplit(v.report) },
    findings: review.findings,
    viewer: { mayRecord },
  }
}
