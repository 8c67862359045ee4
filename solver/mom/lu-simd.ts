/**
 * The LU's rank-k update kernel in WebAssembly with 128-bit SIMD (two doubles per operation), emitted
 * byte by byte here so the project needs no toolchain. JavaScript numbers are scalar, so this roughly
 * doubles the kernel's arithmetic rate; where WebAssembly SIMD is missing, lu.ts falls back to its JS
 * kernel.
 *
 * The kernel does exactly what lu.ts's kernel4x2 does, on matrices copied into the module's memory
 * (split real/imaginary, row-major, byte offsets `re` and `im`):
 *
 *   A[i+r, j] −= Σ_k A[i+r, k]·A[k, j]   for r = 0..3, k in [k0, k1), j in [j0, j1);
 *
 * k1 − k0 and j1 − j0 even. Pivots go two at a time (as kernel4x2) in a loop inside the module, so one
 * call covers a whole row block: the four rows stay in L1 and the JS→Wasm transition is paid once.
 *
 * Encoding references: WebAssembly Core Specification 2.0, §5 (binary format), and its SIMD instruction
 * table (prefix 0xFD, LEB128 opcodes).
 */

export interface SimdKernel {
  memory: WebAssembly.Memory;
  /** (re, im, n, i, k0, k1, j0, j1): byte offsets of the two arrays, then element indices;
   *  k1 − k0 and j1 − j0 even. */
  kernel4x2: (
    re: number,
    im: number,
    n: number,
    i: number,
    k0: number,
    k1: number,
    j0: number,
    j1: number,
  ) => void;
}

let cached: SimdKernel | null | undefined;

/** The compiled kernel, or null when this runtime lacks WebAssembly SIMD. Compiled once, synchronously. */
export function simdKernel(): SimdKernel | null {
  if (cached !== undefined) return cached;
  cached = null;
  try {
    if (typeof WebAssembly !== "object") return null;
    const bytes = buildModule();
    if (!WebAssembly.validate(bytes)) return null;
    const memory = new WebAssembly.Memory({ initial: 1 });
    const instance = new WebAssembly.Instance(new WebAssembly.Module(bytes), { m: { m: memory } });
    cached = { memory, kernel4x2: instance.exports.k42 as SimdKernel["kernel4x2"] };
  } catch {
    cached = null;
  }
  return cached;
}

/** For tests: forget the compiled kernel so the JS path can be exercised, or re-enable SIMD. */
export function setSimdEnabled(on: boolean): void {
  cached = on ? undefined : null;
}

// --- binary encoding -------------------------------------------------------------------------------

const I32 = 0x7f;
const V128 = 0x7b;

function uleb(x: number): number[] {
  const out: number[] = [];
  do {
    let b = x & 0x7f;
    x >>>= 7;
    if (x !== 0) b |= 0x80;
    out.push(b);
  } while (x !== 0);
  return out;
}

function sleb(x: number): number[] {
  const out: number[] = [];
  for (;;) {
    const b = x & 0x7f;
    x >>= 7;
    if ((x === 0 && (b & 0x40) === 0) || (x === -1 && (b & 0x40) !== 0)) {
      out.push(b);
      return out;
    }
    out.push(b | 0x80);
  }
}

const str = (s: string) => [...uleb(s.length), ...Array.from(s, (c) => c.charCodeAt(0))];
const vec = (items: number[][]) => [...uleb(items.length), ...items.flat()];
const section = (id: number, body: number[]) => [id, ...uleb(body.length), ...body];

// Instructions used (core §5.4; SIMD opcodes after the 0xFD prefix).
const get = (l: number) => [0x20, ...uleb(l)];
const set = (l: number) => [0x21, ...uleb(l)];
const i32c = (v: number) => [0x41, ...sleb(v)];
const i32add = [0x6a];
const i32mul = [0x6c];
const i32shl = [0x74];
const i32ltu = [0x49];
const i32geu = [0x4f];
const simd = (op: number, ...imm: number[]) => [0xfd, ...uleb(op), ...imm];
/** memarg: alignment exponent 3 (8-byte aligned doubles), then a constant byte offset. */
const v128load = (offset = 0) => simd(0x00, 3, ...uleb(offset));
const v128store = (offset = 0) => simd(0x0b, 3, ...uleb(offset));
const load64splat = (offset = 0) => simd(0x0a, 3, ...uleb(offset));
const f64x2add = simd(0xf0);
const f64x2sub = simd(0xf1);
const f64x2mul = simd(0xf2);

function buildModule(): Uint8Array<ArrayBuffer> {
  // Parameters 0..7: re, im, n, i, k0, k1, j0, j1.
  const [RE, IM, N, I, K, K1, J0, J1] = [0, 1, 2, 3, 4, 5, 6, 7];
  // i32 locals (K is advanced in place by the pivot loop).
  const OFF = 8;
  const END = 9;
  const OFF0 = 10;
  const PA = [11, 12, 13, 14]; // &re[(i+r)·n]
  const QA = [15, 16, 17, 18]; // &im[(i+r)·n]
  const PU = [19, 20]; // &re[(k+p)·n]
  const QU = [21, 22]; // &im[(k+p)·n]
  // v128 locals: the splatted multipliers L[i+r, k+p] and the loaded pivot-row pairs.
  const L = (r: number, p: number, imag: number) => 23 + (r * 2 + p) * 2 + imag;
  const U = (p: number, imag: number) => 39 + p * 2 + imag;

  const body: number[] = [];
  const emit = (...parts: number[][]) => {
    for (const p of parts) body.push(...p);
  };
  emit(get(J0), i32c(3), i32shl, set(OFF0), get(J1), i32c(3), i32shl, set(END));
  // Row base addresses: byte offset ((row)·n)·8 from each array's start.
  const rowBase = (rowParam: number, add: number, arr: number, dst: number) =>
    emit(get(rowParam), i32c(add), i32add, get(N), i32mul, i32c(3), i32shl, get(arr), i32add, set(dst));
  for (let r = 0; r < 4; r++) {
    rowBase(I, r, RE, PA[r]);
    rowBase(I, r, IM, QA[r]);
  }
  // block { if k ≥ k1: break; loop over pivot pairs { … k += 2; continue while k < k1 } }
  emit([0x02, 0x40], get(K), get(K1), i32geu, [0x0d, 0], [0x03, 0x40]);
  for (let p = 0; p < 2; p++) {
    rowBase(K, p, RE, PU[p]);
    rowBase(K, p, IM, QU[p]);
  }
  // Multipliers: L[i+r, k+p] at row base + k·8 + p·8, splatted to both lanes.
  for (let r = 0; r < 4; r++) {
    for (let p = 0; p < 2; p++) {
      emit(get(PA[r]), get(K), i32c(3), i32shl, i32add, load64splat(p * 8), set(L(r, p, 0)));
      emit(get(QA[r]), get(K), i32c(3), i32shl, i32add, load64splat(p * 8), set(L(r, p, 1)));
    }
  }
  // block { if off ≥ end: break; loop over column pairs { … off += 16; continue while off < end } }
  emit(get(OFF0), set(OFF), [0x02, 0x40], get(OFF), get(END), i32geu, [0x0d, 0], [0x03, 0x40]);
  for (let p = 0; p < 2; p++) {
    emit(get(PU[p]), get(OFF), i32add, v128load(), set(U(p, 0)));
    emit(get(QU[p]), get(OFF), i32add, v128load(), set(U(p, 1)));
  }
  for (let r = 0; r < 4; r++) {
    // Real part: a_re −= Σ_p (l_re·u_re − l_im·u_im).
    emit(get(PA[r]), get(OFF), i32add); // store address
    emit(get(PA[r]), get(OFF), i32add, v128load());
    emit(get(L(r, 0, 0)), get(U(0, 0)), f64x2mul, get(L(r, 0, 1)), get(U(0, 1)), f64x2mul, f64x2sub);
    emit(
      get(L(r, 1, 0)),
      get(U(1, 0)),
      f64x2mul,
      f64x2add,
      get(L(r, 1, 1)),
      get(U(1, 1)),
      f64x2mul,
      f64x2sub,
    );
    emit(f64x2sub, v128store());
    // Imaginary part: a_im −= Σ_p (l_re·u_im + l_im·u_re).
    emit(get(QA[r]), get(OFF), i32add);
    emit(get(QA[r]), get(OFF), i32add, v128load());
    emit(get(L(r, 0, 0)), get(U(0, 1)), f64x2mul, get(L(r, 0, 1)), get(U(0, 0)), f64x2mul, f64x2add);
    emit(
      get(L(r, 1, 0)),
      get(U(1, 1)),
      f64x2mul,
      f64x2add,
      get(L(r, 1, 1)),
      get(U(1, 0)),
      f64x2mul,
      f64x2add,
    );
    emit(f64x2sub, v128store());
  }
  emit(get(OFF), i32c(16), i32add, set(OFF), get(OFF), get(END), i32ltu, [0x0d, 0], [0x0b], [0x0b]);
  emit(get(K), i32c(2), i32add, set(K), get(K), get(K1), i32ltu, [0x0d, 0], [0x0b], [0x0b]);
  body.push(0x0b); // end of function

  const locals = vec([
    [...uleb(15), I32],
    [...uleb(20), V128],
  ]);
  const func = [...locals, ...body];
  const funcType = [0x60, ...vec([[I32], [I32], [I32], [I32], [I32], [I32], [I32], [I32]]), ...vec([])];
  const bytes = [
    ...[0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00],
    ...section(1, vec([funcType])),
    ...section(2, vec([[...str("m"), ...str("m"), 0x02, 0x00, ...uleb(1)]])), // memory import, min 1 page
    ...section(3, vec([uleb(0)])),
    ...section(7, vec([[...str("k42"), 0x00, ...uleb(0)]])),
    ...section(10, vec([[...uleb(func.length), ...func]])),
  ];
  const out = new Uint8Array(new ArrayBuffer(bytes.length));
  out.set(bytes);
  return out;
}
