/**
 * Turns the bytes of an upload into text, or says once, clearly, why they cannot be read: empty, binary,
 * UTF-16 without a byte-order mark, or bytes that are not UTF-8. UTF-16 with a byte-order mark (what some
 * spreadsheet programs write as "Unicode text") is accepted; UTF-8 with or without a byte-order mark too.
 */
import { isUtf8 } from 'node:buffer'
import { uploadError, type UploadProblem } from './problems.js'

export type TextEncoding = 'utf-8' | 'utf-16le' | 'utf-16be'

export type DecodedText =
  { ok: true; text: string; encoding: TextEncoding; byteOrderMark: boolean } | { ok: false; problem: UploadProblem }

const SAVE_AS = 'Save it from your spreadsheet as CSV with UTF-8 encoding and upload it again.'

const unreadable = (row: number | null, message: string): DecodedText => ({
  ok: false,
  problem: uploadError(row, null, null, message),
})

/** The line (1-based) that holds byte `offset`. */
function lineOfByte(bytes: Buffer, offset: number): number {
  let line = 1
  for (let i = 0; i < offset && i < bytes.length; i++) if (bytes[i] === 0x0a) line++
  return line
}

/** Where `bytes` stop being UTF-8, to name the line (`isUtf8` gives the verdict; this only locates it). */
function firstInvalidUtf8(bytes: Buffer): number | null {
  let i = 0
  while (i < bytes.length) {
    const b = bytes[i]
    if (b < 0x80) {
      i++
      continue
    }
    const n = b >= 0xc2 && b <= 0xdf ? 1 : b >= 0xe0 && b <= 0xef ? 2 : b >= 0xf0 && b <= 0xf4 ? 3 : -1
    if (n < 0 || i + n >= bytes.length) return i
    for (let k = 1; k <= n; k++) if ((bytes[i + k] & 0xc0) !== 0x80) return i
    i += n + 1
  }
  return null
}

/** Decode an uploaded CSV file; never throws. */
export function decodeUpload(content: Buffer | string): DecodedText {
  if (typeof content === 'string') {
    const bom = content.startsWith('\uFEFF')
    return checkText(bom ? content.slice(1) : content, 'utf-8', bom)
  }
  const bytes = content
  if (bytes.length >= 2 && bytes[0] === 0xff && bytes[1] === 0xfe)
    return checkText(new TextDecoder('utf-16le').decode(bytes.subarray(2)), 'utf-16le', true)
  if (bytes.length >= 2 && bytes[0] === 0xfe && bytes[1] === 0xff)
    return checkText(new TextDecoder('utf-16be').decode(bytes.subarray(2)), 'utf-16be', true)
  const nul = bytes.indexOf(0)
  if (nul >= 0) {
    // Every other byte zero in the first line: UTF-16 text that lost (or never had) its byte-order mark.
    const head = bytes.subarray(0, Math.min(bytes.length, 200))
    let zerosOdd = 0
    let zerosEven = 0
    head.forEach((b, i) => b === 0 && (i % 2 ? zerosOdd++ : zerosEven++))
    if (
      head.length >= 8 &&
      Math.max(zerosOdd, zerosEven) >= 0.4 * head.length &&
      Math.min(zerosOdd, zerosEven) <= 0.05 * head.length
    )
      return unreadable(
        null,
        `The file looks like UTF-16 text without a byte-order mark, which cannot be read. ${SAVE_AS}`,
      )
    return unreadable(
      null,
      `The file is not a text CSV file: it holds binary data (a zero byte on line ${lineOfByte(bytes, nul)}). ` +
        `Export the run sheet as CSV (not a workbook or a PDF). ${SAVE_AS}`,
    )
  }
  const bad = isUtf8(bytes) ? null : (firstInvalidUtf8(bytes) ?? 0)
  if (bad !== null)
    return unreadable(
      lineOfByte(bytes, bad),
      `Line ${lineOfByte(bytes, bad)} holds bytes that are not UTF-8 text (byte 0x${bytes[bad].toString(16).toUpperCase()}); ` +
        `the file was probably saved in an older encoding. ${SAVE_AS}`,
    )
  const bom = bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf
  return checkText(bytes.toString('utf8', bom ? 3 : 0), 'utf-8', bom)
}

function checkText(text: string, encoding: TextEncoding, byteOrderMark: boolean): DecodedText {
  if (text.trim() === '') return unreadable(null, 'The file is empty.')
  const nul = text.indexOf('\u0000')
  if (nul >= 0)
    return unreadable(
      text.slice(0, nul).split('\n').length,
      `The file is not a text CSV file: it holds a zero character. ${SAVE_AS}`,
    )
  return { ok: true, text, encoding, byteOrderMark }
}
