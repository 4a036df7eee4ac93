import { SignalProblemError } from './signal-problem';

/**
 * The RIFF/WAVE container walked by hand: every chunk's size is checked against the file before anything
 * is read, only `fmt ` and `data` (and RF64's `ds64`) are decoded, and the few chunk types whose bodies
 * declare counts (`cue `, `smpl`, `LIST`, `inst`, `bext`, `fact`) have those counts checked against their
 * own size without allocating anything for them. A hostile count therefore costs nothing and is refused.
 *
 * Layout sources: Microsoft/IBM *Multimedia Programming Interface and Data Specifications 1.0* (1991) for
 * RIFF, `fmt `, `data`, `cue `, `smpl`, `inst`, `LIST` and `fact`; Microsoft's WAVEFORMATEXTENSIBLE
 * (mmreg.h / ksmedia.h) for the extensible format; EBU Tech 3285 for `bext`; EBU Tech 3306 (RF64) and
 * ITU-R BS.2088 (BW64) for 64-bit sizes.
 */

export type WaveContainer = 'RIFF' | 'RIFX' | 'RF64' | 'BW64';

export interface WaveChunk {
  /** Four-character chunk id, e.g. `fmt `, `data`, `LIST`. */
  id: string;
  /** Byte offset of the chunk header in the file. */
  offset: number;
  /** Size of the chunk body in bytes (the 64-bit size from `ds64` for RF64/BW64). */
  size: number;
}

export interface WaveFormat {
  /** 1 = PCM, 3 = IEEE float; for WAVE_FORMAT_EXTENSIBLE the sub-format's code. */
  formatCode: number;
  extensible: boolean;
  channelCount: number;
  sampleRateHz: number;
  blockAlign: number;
  /** Bits of each sample's container. */
  bitsPerSample: number;
  /** Bits that carry signal (extensible only; otherwise equal to bitsPerSample). */
  validBitsPerSample: number;
}

export interface WaveLayout {
  container: WaveContainer;
  littleEndian: boolean;
  format: WaveFormat;
  /** Byte offset of the first sample frame. */
  dataOffset: number;
  /** Bytes of whole frames in the data chunk. */
  dataBytes: number;
  chunks: WaveChunk[];
}

/** A size written by recorders that did not know the length yet (and RF64's "see ds64"). */
const UNKNOWN_SIZE = 0xffffffff;
const WAVE_FORMAT_EXTENSIBLE = 0xfffe;
/** More chunks than any real recorder writes; past this the file is refused rather than walked. */
export const MAX_WAVE_CHUNKS = 1024;
/** Bytes 4..15 of the KSDATAFORMAT_SUBTYPE_* GUIDs {0000000x-0000-0010-8000-00AA00389B71}. */
const KS_GUID_TAIL = [0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71];

const malformed = (message: string) => new SignalProblemError(message, 'malformed');
const truncated = (message: string) => new SignalProblemError(message, 'truncated');

function ascii(bytes: Uint8Array, offset: number): string {
  return String.fromCharCode(bytes[offset], bytes[offset + 1], bytes[offset + 2], bytes[offset + 3]);
}

function printableId(bytes: Uint8Array, offset: number): boolean {
  for (let i = 0; i < 4; i++) if (bytes[offset + i] < 0x20 || bytes[offset + i] > 0x7e) return false;
  return true;
}

const hex = (bytes: Uint8Array, offset: number, length: number): string =>
  Array.from(bytes.subarray(offset, offset + length), (b) => b.toString(16).padStart(2, '0')).join(' ');

/**
 * Reads the structure of a WAVE file: its container, format and where its sample frames lie.
 *
 * Accepted: RIFF (little-endian), RIFX (big-endian), RF64 and BW64 (64-bit sizes in a `ds64` chunk);
 * chunks in any order, odd-sized chunks followed by their pad byte (a missing pad byte at the very end is
 * tolerated), a `data` size of 0xFFFFFFFF in a plain RIFF file (a recorder that never went back to write
 * it) meaning "to the end of the file", and bytes after the RIFF form (ignored).
 *
 * @param bytes the whole file.
 * @throws SignalProblemError `emptyFile`, `notWav`, `truncated` (a chunk runs past the end of the file,
 *   no `fmt ` or `data` chunk) or `malformed` (sizes, counts or ids that contradict the file).
 */
export function readWaveLayout(bytes: Uint8Array): WaveLayout {
  if (bytes.length === 0) throw new SignalProblemError('The file is empty (0 bytes).', 'emptyFile');
  const head = bytes.length >= 4 ? ascii(bytes, 0) : '';
  const isRiffHead = ['RIFF', 'RIFX', 'RF64', 'BW64'].includes(head);
  if (!isRiffHead || (bytes.length >= 12 && ascii(bytes, 8) !== 'WAVE')) {
    throw new SignalProblemError('The file is not a WAV file (no RIFF/WAVE header).', 'notWav');
  }
  if (bytes.length < 12) {
    throw truncated(`The file is truncated: ${bytes.length} bytes is shorter than a RIFF header (12 bytes).`);
  }
  const container = head as WaveContainer;
  const littleEndian = container !== 'RIFX';
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const u16 = (offset: number) => view.getUint16(offset, littleEndian);
  const u32 = (offset: number) => view.getUint32(offset, littleEndian);
  const u64 = (offset: number) => u32(offset) + u32(offset + 4) * 2 ** 32;

  const wide = container === 'RF64' || container === 'BW64';
  const ds64 = wide ? readDs64(bytes, u32, u64) : undefined;
  const riffSize = ds64 && u32(4) === UNKNOWN_SIZE ? ds64.riffSize : u32(4);
  const sizeUnknown = !wide && (riffSize === UNKNOWN_SIZE || riffSize === 0);
  // Walk to the declared end of the form or of the file, whichever comes first; a declared end beyond the
  // file (by more than a final pad byte a writer counted but never wrote) is a truncated file.
  const declaredEnd = sizeUnknown ? bytes.length : 8 + riffSize;
  const cutShort = declaredEnd > bytes.length + 1;
  const formEnd = Math.min(declaredEnd, bytes.length);
  const overrun = (message: string) =>
    cutShort
      ? truncated(`The file is truncated: ${message}`)
      : malformed(`The file is malformed: ${message}`);

  const chunks: WaveChunk[] = [];
  let fmtChunk: WaveChunk | undefined;
  let dataChunk: { offset: number; size: number; toEnd: boolean } | undefined;
  let offset = 12;
  while (offset < formEnd) {
    if (formEnd - offset < 8) {
      if (bytes.subarray(offset, formEnd).every((b) => b === 0)) break;
      throw malformed(
        `The file is malformed: ${formEnd - offset} stray byte(s) at byte ${offset}, too few for a chunk header.`,
      );
    }
    if (!printableId(bytes, offset)) {
      throw malformed(
        `The file is malformed: the chunk at byte ${offset} has no valid id (bytes ${hex(bytes, offset, 4)}); a chunk size before it is probably wrong.`,
      );
    }
    const id = ascii(bytes, offset);
    const declared = u32(offset + 4);
    const bodyStart = offset + 8;
    let size = declared;
    let toEnd = false;
    if (wide && declared === UNKNOWN_SIZE) {
      const fromDs64 = id === 'data' ? ds64?.dataSize : ds64?.table.get(id);
      if (fromDs64 === undefined) {
        throw malformed(
          `The file is malformed: the '${id}' chunk at byte ${offset} defers its size to the ds64 chunk, which does not give it.`,
        );
      }
      size = fromDs64;
    } else if (!wide && id === 'data' && declared === UNKNOWN_SIZE) {
      size = formEnd - bodyStart;
      toEnd = true;
    }
    if (bodyStart + size > formEnd) {
      const remaining = formEnd - bodyStart;
      if (id === 'data') {
        throw truncated(
          `The file is truncated: its data chunk declares ${size} bytes but only ${remaining} are present.`,
        );
      }
      throw overrun(
        `the '${id}' chunk at byte ${offset} declares ${size} bytes but only ${remaining} remain.`,
      );
    }
    if (chunks.length >= MAX_WAVE_CHUNKS) {
      throw malformed(`The file is malformed: it has more than ${MAX_WAVE_CHUNKS} chunks.`);
    }
    const chunk = { id, offset, size };
    chunks.push(chunk);

    if (id === 'fmt ') {
      if (fmtChunk) throw malformed(`The file is malformed: a second 'fmt ' chunk at byte ${offset}.`);
      fmtChunk = chunk;
    } else if (id === 'data') {
      if (dataChunk) throw malformed(`The file is malformed: a second data chunk at byte ${offset}.`);
      dataChunk = { offset, size, toEnd };
    } else if (id === 'ds64' && (!wide || offset !== 12)) {
      throw malformed(
        `The file is malformed: a ds64 chunk at byte ${offset} (only RF64/BW64 files start with one).`,
      );
    } else {
      checkDeclaredCounts(id, offset, size, bodyStart, u32, bytes, littleEndian);
    }
    const next = bodyStart + size + (size % 2);
    if (next > formEnd) break; // the last chunk, missing its pad byte
    offset = next;
  }

  if (cutShort) {
    throw truncated(
      `The file is truncated: its RIFF header declares ${declaredEnd} bytes but the file has ${bytes.length}.`,
    );
  }
  if (!fmtChunk) throw truncated('The file is truncated or incomplete: it has no format chunk.');
  if (!dataChunk) throw truncated('The file is truncated or incomplete: it has no data chunk.');
  const format = readFormat(fmtChunk, u16, u32, bytes);
  const frameBytes = dataChunk.size - (dataChunk.size % format.blockAlign);
  if (frameBytes !== dataChunk.size) {
    if (dataChunk.toEnd) {
      throw truncated(
        `The file is truncated: the data ends inside a frame (${dataChunk.size} bytes is not a multiple of the ${format.blockAlign}-byte frame).`,
      );
    }
    throw malformed(
      `The file is malformed: its data chunk holds ${dataChunk.size} bytes, not a whole number of ${format.blockAlign}-byte frames.`,
    );
  }
  return { container, littleEndian, format, dataOffset: dataChunk.offset + 8, dataBytes: frameBytes, chunks };
}

interface Ds64 {
  riffSize: number;
  dataSize: number;
  table: Map<string, number>;
}

/** The ds64 chunk of an RF64/BW64 file (EBU Tech 3306 §3; ITU-R BS.2088 §3): must come first. */
function readDs64(bytes: Uint8Array, u32: (o: number) => number, u64: (o: number) => number): Ds64 {
  if (bytes.length < 20 || ascii(bytes, 12) !== 'ds64') {
    throw malformed('The file is malformed: an RF64/BW64 file must begin with a ds64 chunk.');
  }
  const size = u32(16);
  if (size < 28 || 20 + size > bytes.length) {
    throw malformed(
      `The file is malformed: its ds64 chunk declares ${size} bytes; it needs at least 28 and the file has ${bytes.length - 20} after its header.`,
    );
  }
  const tableLength = u32(20 + 24);
  if (tableLength > Math.floor((size - 28) / 12)) {
    throw malformed(
      `The file is malformed: its ds64 chunk declares ${tableLength} table entries, but its ${size} bytes hold at most ${Math.floor((size - 28) / 12)}.`,
    );
  }
  const table = new Map<string, number>();
  for (let i = 0; i < tableLength; i++) {
    const entry = 20 + 28 + i * 12;
    table.set(ascii(bytes, entry), u64(entry + 4));
  }
  return { riffSize: u64(20), dataSize: u64(28), table };
}

/**
 * Counts declared inside chunks this reader does not otherwise use, checked against the chunk's size
 * (the layouts of the RIFF specification 1991 and EBU Tech 3285). Nothing is read beyond the counts.
 */
function checkDeclaredCounts(
  id: string,
  offset: number,
  size: number,
  body: number,
  u32: (o: number) => number,
  bytes: Uint8Array,
  littleEndian: boolean,
): void {
  const tooSmall = (needed: number, what: string) =>
    malformed(
      `The file is malformed: the '${id}' chunk at byte ${offset} is ${size} bytes but ${what} ${needed}.`,
    );
  switch (id) {
    case 'cue ': {
      // dwCuePoints, then 24 bytes per cue point.
      if (size < 4) throw tooSmall(4, 'its cue-point count needs');
      const points = u32(body);
      if (4 + 24 * points > size) throw tooSmall(4 + 24 * points, `its ${points} declared cue points need`);
      return;
    }
    case 'smpl': {
      // Nine 32-bit fields (cSampleLoops at +28, cbSamplerData at +32), 24 bytes per loop, then sampler data.
      if (size < 36) throw tooSmall(36, 'its header needs');
      const loops = u32(body + 28);
      const samplerData = u32(body + 32);
      if (36 + 24 * loops + samplerData > size) {
        throw tooSmall(
          36 + 24 * loops + samplerData,
          `its ${loops} declared loops and ${samplerData} bytes of sampler data need`,
        );
      }
      return;
    }
    case 'inst':
      if (size < 7) throw tooSmall(7, 'its seven fields need');
      return;
    case 'fact':
      if (size < 4) throw tooSmall(4, 'its sample count needs');
      return;
    case 'bext':
      // EBU Tech 3285: 602 bytes of fixed fields before the coding history.
      if (size < 602) throw tooSmall(602, 'its fixed fields need');
      return;
    case 'LIST':
      checkListChunk(offset, size, body, bytes, littleEndian);
      return;
  }
}

/** A LIST chunk is a list type and sub-chunks; every sub-chunk must fit inside it. */
function checkListChunk(
  offset: number,
  size: number,
  body: number,
  bytes: Uint8Array,
  littleEndian: boolean,
): void {
  if (size < 4) {
    throw malformed(
      `The file is malformed: the 'LIST' chunk at byte ${offset} is ${size} bytes, too short for its list type.`,
    );
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const end = body + size;
  let sub = body + 4;
  let count = 0;
  while (sub + 8 <= end) {
    if (++count > MAX_WAVE_CHUNKS) {
      throw malformed(
        `The file is malformed: the 'LIST' chunk at byte ${offset} holds more than ${MAX_WAVE_CHUNKS} entries.`,
      );
    }
    const subSize = view.getUint32(sub + 4, littleEndian);
    if (sub + 8 + subSize > end) {
      throw malformed(
        `The file is malformed: the '${ascii(bytes, sub)}' entry at byte ${sub} of the 'LIST' chunk at byte ${offset} declares ${subSize} bytes but only ${end - sub - 8} remain in the list.`,
      );
    }
    sub += 8 + subSize + (subSize % 2);
  }
}

function readFormat(
  chunk: WaveChunk,
  u16: (o: number) => number,
  u32: (o: number) => number,
  bytes: Uint8Array,
): WaveFormat {
  const body = chunk.offset + 8;
  if (chunk.size < 16) {
    throw malformed(
      `The file is malformed: its format chunk is ${chunk.size} bytes; at least 16 are needed.`,
    );
  }
  const tag = u16(body);
  const channelCount = u16(body + 2);
  const sampleRateHz = u32(body + 4);
  const blockAlign = u16(body + 12);
  const bitsPerSample = u16(body + 14);
  let formatCode = tag;
  let validBitsPerSample = bitsPerSample;
  const extensible = tag === WAVE_FORMAT_EXTENSIBLE;
  if (extensible) {
    if (chunk.size < 40 || u16(body + 16) < 22) {
      throw malformed(
        `The file is malformed: its extensible format chunk is ${chunk.size} bytes; WAVE_FORMAT_EXTENSIBLE needs 40.`,
      );
    }
    validBitsPerSample = u16(body + 18) || bitsPerSample;
    formatCode = u32(body + 24);
    const data2 = u16(body + 28);
    const data3 = u16(body + 30);
    const tail = Array.from(bytes.subarray(body + 32, body + 40));
    if (data2 !== 0 || data3 !== 0x0010 || tail.some((b, i) => b !== KS_GUID_TAIL[i])) {
      throw new SignalProblemError(
        'The encoding is not supported: the extensible sub-format is not a standard PCM or float GUID.',
        'unsupportedEncoding',
      );
    }
    if (validBitsPerSample > bitsPerSample) {
      throw malformed(
        `The file is malformed: ${validBitsPerSample} valid bits cannot fit a ${bitsPerSample}-bit sample container.`,
      );
    }
  }
  if (channelCount === 0) throw malformed('The file is malformed: its format chunk declares 0 channels.');
  return {
    formatCode,
    extensible,
    channelCount,
    sampleRateHz,
    blockAlign,
    bitsPerSample,
    validBitsPerSample,
  };
}
