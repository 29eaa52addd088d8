/*
 * The fast reader's line scanner as WebAssembly: the same rules as the scanners compiled by
 * src/io/compiledScan.ts (read that file first; this one follows it line by line), run without
 * JIT warm-up. Freestanding: no libc, memory imported from JS, built by scripts/build-wasm.sh
 * into src/io/wasm/scanWasm.ts.
 *
 * One call parses whole plain lines of [i, stop) into an output area (per row: the numbers,
 * the key ids, the line's start and end) and stops at the first line it does not take, at a key
 * that differs from its slot's memo (JS interns it, writes the memo and calls again from that
 * line's start), when the area is full, or at `stop`. Nothing here has a side effect outside
 * the output area, so JS hands the rows on in order and the sink sees what the JS scanner gives.
 */

typedef unsigned char u8;
typedef unsigned long long u64;

#define EXPORT(name) __attribute__((export_name(name)))

enum { SKIP = 0, NUM = 1, KEY = 2 };
/*
 * Why scan() returned (res[0]); res[1] = where it stopped (a line start, or stop), res[2] = rows
 * written; for NEWKEY res[3..5] = the key's slot, start and end.
 */
enum { END = 0, FULL = 1, SLOW = 2, NEWKEY = 3 };

/* Exact powers of ten (all representable in binary64 up to 1e22). */
static const double POW10[23] = {
  1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
  1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22,
};

static int nf, delim, dc, numCount, keyCount, cap, memoMax;
static const u8 *kinds;
static const int *slots;
static const u8 *memoBytes;
static const int *memoLen, *memoId;
static double *outNums;
static int *outKeys, *outStart, *outEnd;
static int res[6];

/** The field layout and the areas (addresses in this module's memory) that scan() uses. */
EXPORT("configure")
int *configure(int nFields, const u8 *kindsAt, const int *slotsAt, int delimiter, int decimalComma,
               int nNums, int nKeys, const u8 *memoAt, int memoBytesPerSlot, const int *memoLenAt,
               const int *memoIdAt, int capacity, double *numsAt, int *keysAt, int *startAt, int *endAt) {
  nf = nFields; kinds = kindsAt; slots = slotsAt; delim = delimiter; dc = decimalComma;
  numCount = nNums; keyCount = nKeys; memoBytes = memoAt; memoMax = memoBytesPerSlot;
  memoLen = memoLenAt; memoId = memoIdAt; cap = capacity;
  outNums = numsAt; outKeys = keysAt; outStart = startAt; outEnd = endAt;
  return res;
}

/*
 * One number field from p: sign, digits, fraction, exponent (compiledScan.ts numberField).
 * Returns the position after it, or −1 when the line goes to the text routine. The digits are
 * summed in an integer: with at most 15 of them every partial sum is an integer below 2^53, so
 * JS's double sum m·10 + d is exact too and both convert to the same double.
 */
static int number(const u8 *b, int p, double *out) {
  int neg = 0;
  u8 c = b[p];
  if (c == 45) { neg = 1; p++; } else if (c == 43) p++;
  u64 m = 0;
  int nd = 0, frac = 0;
  for (;;) { unsigned d = (unsigned)b[p] - 48u; if (d > 9) break; m = m * 10 + d; nd++; p++; }
  c = b[p];
  if (c == 46 || (dc && c == 44)) {
    p++;
    for (;;) { unsigned d = (unsigned)b[p] - 48u; if (d > 9) break; m = m * 10 + d; nd++; frac++; p++; }
    c = b[p];
  }
  if (nd == 0 || nd > 15) return -1;
  int exp = 0;
  if (c == 101 || c == 69) {
    p++;
    int eneg = 0, ed = 0;
    if (b[p] == 45) { eneg = 1; p++; } else if (b[p] == 43) p++;
    for (;;) { unsigned d = (unsigned)b[p] - 48u; if (d > 9 || ed > 4) break; exp = exp * 10 + (int)d; ed++; p++; }
    if (ed == 0 || ed > 4) return -1;
    if (eneg) exp = -exp;
  }
  int e10 = exp - frac;
  double v = (double)(long long)m;
  if (e10 == 0) {}
  else if (e10 < 0 && e10 >= -22) v = v / POW10[-e10];
  else if (e10 > 0 && e10 <= 22) v = v * POW10[e10];
  else return -1;
  *out = neg ? -v : v;
  return p;
}

/** Parse lines of b[i, stop) (every one ends with '\n' before stop); see the file comment. */
EXPORT("scan")
int scan(const u8 *b, int i, int stop) {
  int r = 0, why = END;
  while (i < stop) {
    if (r == cap) { why = FULL; break; }
    u8 c0 = b[i];
    if (c0 == 35 || c0 == 10 || c0 == 13) { why = SLOW; break; }
    int p = i;
    double *nums = outNums + r * numCount;
    int *keys = outKeys + r * keyCount;
    for (int f = 0; f < nf; f++) {
      int k = kinds[f];
      if (k == NUM) {
        p = number(b, p, &nums[slots[f]]);
        if (p < 0) goto slow;
      } else {
        int q0 = p;
        for (;;) { u8 c = b[p]; if (c == delim || c == 10 || c == 13) break; if (c == 34) goto slow; p++; }
        if (k == KEY) {
          int slot = slots[f], len = p - q0;
          if (len == 0) goto slow;
          int same = len == memoLen[slot];
          const u8 *mb = memoBytes + slot * memoMax;
          for (int j = 0; same && j < len; j++) if (b[q0 + j] != mb[j]) same = 0;
          if (!same) { why = NEWKEY; res[3] = slot; res[4] = q0; res[5] = p; goto out; }
          keys[slot] = memoId[slot];
        }
      }
      if (f < nf - 1) { if (b[p] != delim) goto slow; p++; }
    }
    int e = p;
    if (b[p] == 13) p++;
    if (b[p] != 10) goto slow;
    outStart[r] = i; outEnd[r] = e;
    r++;
    i = p + 1;
  }
  goto out;
slow:
  why = SLOW;
out:
  res[0] = why; res[1] = i; res[2] = r;
  return why;
}
