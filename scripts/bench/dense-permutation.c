/* Single-threaded dense permutation test of per-site temporal beta diversity, the native
 * baseline for scripts/bench-engine.ts. Straightforward on purpose: every permutation
 * shuffles every species column in full (Fisher-Yates) and recomputes every cell.
 * Tables are stored species-major so both the shuffle and the per-site sums run
 * sequentially through memory.
 *
 * Input (text, from the benchmark): n p R seed index mode, then T1 and T2 as n*p values
 * each, site-major. index: 0 jaccard, 1 sorensen, 2 ruzicka, 3 percentage difference
 * (presence-absence conversion already done by the caller for 0 and 1). mode: 0 paired,
 * 1 independent.
 * Output: "seconds S" (permutation phase, monotonic clock), then one p-value per site.
 */
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <time.h>

static uint32_t s[4];

static inline uint32_t rotl(uint32_t x, int k) { return (x << k) | (x >> (32 - k)); }

/* xoshiro128** (Blackman & Vigna). */
static inline uint32_t next(void) {
  const uint32_t result = rotl(s[1] * 5, 7) * 9;
  const uint32_t t = s[1] << 9;
  s[2] ^= s[0];
  s[3] ^= s[1];
  s[1] ^= s[2];
  s[0] ^= s[3];
  s[2] ^= t;
  s[3] = rotl(s[3], 11);
  return result;
}

static uint64_t splitmix64(uint64_t *x) {
  uint64_t z = (*x += 0x9e3779b97f4a7c15ULL);
  z = (z ^ (z >> 30)) * 0xbf58476d1ce4e5b9ULL;
  z = (z ^ (z >> 27)) * 0x94d049bb133111ebULL;
  return z ^ (z >> 31);
}

/* Lemire's unbiased bounded integer in [0, m). */
static inline uint32_t below(uint32_t m) {
  uint64_t prod = (uint64_t)next() * m;
  uint32_t low = (uint32_t)prod;
  if (low < m) {
    uint32_t threshold = (uint32_t)(-m) % m;
    while (low < threshold) {
      prod = (uint64_t)next() * m;
      low = (uint32_t)prod;
    }
  }
  return (uint32_t)(prod >> 32);
}

static void shuffle(int *perm, int n) {
  for (int i = 0; i < n; i++) perm[i] = i;
  for (int t = 0; t < n - 1; t++) {
    int u = t + (int)below((uint32_t)(n - t));
    int x = perm[t];
    perm[t] = perm[u];
    perm[u] = x;
  }
}

static void sums(const double *y1, const double *y2, int n, int p, double *A, double *B, double *C) {
  for (int i = 0; i < n; i++) A[i] = B[i] = C[i] = 0;
  for (int j = 0; j < p; j++) {
    const double *c1 = y1 + (size_t)j * n;
    const double *c2 = y2 + (size_t)j * n;
    for (int i = 0; i < n; i++) {
      double m = c1[i] < c2[i] ? c1[i] : c2[i];
      A[i] += m;
      B[i] += c1[i] - m;
      C[i] += c2[i] - m;
    }
  }
}

int main(int argc, char **argv) {
  FILE *f = argc > 1 ? fopen(argv[1], "r") : stdin;
  if (!f) { perror("open"); return 2; }
  int n, p, R, index, mode;
  unsigned long long seed;
  if (fscanf(f, "%d %d %d %llu %d %d", &n, &p, &R, &seed, &index, &mode) != 6) { fprintf(stderr, "bad header\n"); return 2; }
  size_t cells = (size_t)n * p;
  double *y1 = malloc(cells * sizeof *y1), *y2 = malloc(cells * sizeof *y2);
  double *q1 = malloc(cells * sizeof *q1), *q2 = malloc(cells * sizeof *q2);
  double *A = malloc(n * sizeof *A), *B = malloc(n * sizeof *B), *C = malloc(n * sizeof *C), *obs = malloc(n * sizeof *obs);
  int *perm1 = malloc(n * sizeof *perm1), *perm2 = malloc(n * sizeof *perm2);
  long *count = calloc(n, sizeof *count);
  for (int t = 0; t < 2; t++)
    for (int i = 0; i < n; i++)
      for (int j = 0; j < p; j++) {
        double v;
        if (fscanf(f, "%lf", &v) != 1) { fprintf(stderr, "bad value\n"); return 2; }
        (t == 0 ? y1 : y2)[(size_t)j * n + i] = v;
      }
  const int twice = index == 1 || index == 3;
  sums(y1, y2, n, p, A, B, C);
  for (int i = 0; i < n; i++) obs[i] = (B[i] + C[i]) / ((twice ? 2 * A[i] : A[i]) + B[i] + C[i]);

  uint64_t sm = seed;
  for (int k = 0; k < 4; k++) s[k] = (uint32_t)splitmix64(&sm);
  struct timespec t0, t1;
  clock_gettime(CLOCK_MONOTONIC, &t0);
  for (int r = 0; r < R; r++) {
    for (int j = 0; j < p; j++) {
      shuffle(perm1, n);
      if (mode == 1) shuffle(perm2, n);
      const int *pp2 = mode == 1 ? perm2 : perm1;
      const double *c1 = y1 + (size_t)j * n, *c2 = y2 + (size_t)j * n;
      double *d1 = q1 + (size_t)j * n, *d2 = q2 + (size_t)j * n;
      for (int i = 0; i < n; i++) {
        d1[perm1[i]] = c1[i];
        d2[pp2[i]] = c2[i];
      }
    }
    sums(q1, q2, n, p, A, B, C);
    for (int i = 0; i < n; i++) {
      double den = (twice ? 2 * A[i] : A[i]) + B[i] + C[i];
      if (den > 0 && (B[i] + C[i]) / den >= obs[i] - 1e-10) count[i]++;
    }
  }
  clock_gettime(CLOCK_MONOTONIC, &t1);
  printf("seconds %.6f\n", (double)(t1.tv_sec - t0.tv_sec) + (t1.tv_nsec - t0.tv_nsec) / 1e9);
  for (int i = 0; i < n; i++) printf("%.10g\n", (1.0 + count[i]) / (1.0 + R));
  return 0;
}
