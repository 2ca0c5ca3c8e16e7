export interface Cluster {
  url: string
  stop: () => void
  start: () => void
  destroy: () => void
}
export function startCluster(o: { dataDir: string; port: number; database: string; fresh?: boolean }): Cluster
export function dataDirFor(root: string, name: string): string
