export const root: string
export const isRoot: boolean
export function log(msg: string): void
export function has(cmd: string): boolean
export function aptInstall(...pkgs: string[]): void
export function postgresBinDir(): string
export function ensureChromium(): string
export function ensureHaproxy(): string
