/* Plain C reference for the Equipot science benchmark: the same sums as the TypeScript kernels
 * (mean removal, running sum of frequency, then overlapping ADEV or MDEV at every octave factor),
 * written as the plain loop, one pass per factor.
 * Usage: science-kernels <file of float64 samples> <oadev|oadev-grouped|mdev|mdev-grouped> <repeats>
 * Prints: <median ms> <deviation at m = 1> <deviation at m = 2> ... */
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

static double now_ms(void) {
  struct timespec t;
  clock_gettime(CLOCK_MONOTONIC, &t);
  return t.tv_sec * 1e3 + t.tv_nsec / 1e6;
}

static void running_sum(const double *y, long n, double *s) {
  double mean = 0;
  for (long i = 0; i < n; i++) mean += y[i];
  mean /= n;
  s[0] = 0;
  for (long i = 0; i < n; i++) s[i + 1] = s[i] + (y[i] - mean);
}

static long oadev_octaves(const double *s, long n, double *out) {
  long k = 0;
  for (long m = 1; m <= n / 2; m *= 2) {
    double sum = 0;
    long last = n - 2 * m;
    for (long i = 0; i <= last; i++) {
      double d = s[i + 2 * m] - 2 * s[i + m] + s[i];
      sum += d * d;
    }
    out[k++] = sqrt(sum / (2.0 * m * m * (last + 1)));
  }
  return k;
}

/* The same sums with octaves m, 2m, 4m sharing loads, as the TypeScript kernel does it. */
static double tail(const double *s, long m, long from, long to, double sum) {
  for (long i = from; i <= to; i++) {
    double d = s[i + 2 * m] - 2 * s[i + m] + s[i];
    sum += d * d;
  }
  return sum;
}

static long oadev_octaves_grouped(const double *s, long n, double *out) {
  long k = 0, m = 1;
  for (; 4 * m <= n / 2; m *= 8) {
    long last = n - 8 * m, i = 0;
    double a = 0, b = 0, c = 0;
    for (; i <= last; i++) {
      double s0 = s[i], s2 = s[i + 2 * m], s4 = s[i + 4 * m];
      double d1 = s2 - 2 * s[i + m] + s0, d2 = s4 - 2 * s2 + s0, d4 = s[i + 8 * m] - 2 * s4 + s0;
      a += d1 * d1;
      b += d2 * d2;
      c += d4 * d4;
    }
    a = tail(s, m, i, n - 2 * m, a);
    b = tail(s, 2 * m, i, n - 4 * m, b);
    out[k++] = sqrt(a / (2.0 * m * m * (n - 2 * m + 1)));
    out[k++] = sqrt(b / (8.0 * m * m * (n - 4 * m + 1)));
    out[k++] = sqrt(c / (32.0 * m * m * (n - 8 * m + 1)));
  }
  for (; m <= n / 2; m *= 2) out[k++] = sqrt(tail(s, m, 0, n - 2 * m, 0) / (2.0 * m * m * (n - 2 * m + 1)));
  return k;
}

static long mdev_octaves(const double *s, long n, double *out) {
  long k = 0;
  for (long m = 1; m <= (n + 1) / 3; m *= 2) {
    long terms = n - 3 * m + 2;
    double inner = 0, sum;
    for (long i = 0; i < m; i++) inner += s[i + 2 * m] - 2 * s[i + m] + s[i];
    sum = inner * inner;
    /* inner(j+1) − inner(j) = S[j+3m] − 3S[j+2m] + 3S[j+m] − S[j] */
    for (long j = 0; j + 1 < terms; j++) {
      inner += s[j + 3 * m] - 3 * s[j + 2 * m] + 3 * s[j + m] - s[j];
      sum += inner * inner;
    }
    double m2 = (double)m * m;
    out[k++] = sqrt(sum / (2.0 * m2 * m2 * terms));
  }
  return k;
}

static double mdev_carry(const double *s, long m, long j0, long terms, double inner, double sum) {
  for (long j = j0; j + 1 < terms; j++) {
    inner += s[j + 3 * m] - 3 * s[j + 2 * m] + 3 * s[j + m] - s[j];
    sum += inner * inner;
  }
  return sum;
}

static double first_inner(const double *s, long m) {
  double inner = 0;
  for (long i = 0; i < m; i++) inner += s[i + 2 * m] - 2 * s[i + m] + s[i];
  return inner;
}

static double mdev_value(double sum, long m, long terms) {
  double m2 = (double)m * m;
  return sqrt(sum / (2.0 * m2 * m2 * terms));
}

/* Factors m and 2m from term j0 to 2m's last term, sharing s[j] and s[j + 2m]. Locals in the
 * loop, so the compiler need not store through the pointers on every term. */
static long mdev_pair(const double *s, long m, long j0, long t2, double *i1, double *a, double *i2, double *b) {
  long j = j0;
  double x = *i1, sa = *a, z = *i2, sb = *b;
  for (; j + 1 < t2; j++) {
    double s0 = s[j], s2 = s[j + 2 * m];
    x += s[j + 3 * m] - 3 * s2 + 3 * s[j + m] - s0;
    z += s[j + 6 * m] - 3 * s[j + 4 * m] + 3 * s2 - s0;
    sa += x * x;
    sb += z * z;
  }
  *i1 = x, *a = sa, *i2 = z, *b = sb;
  return j;
}

/* MDEV with octaves m, 2m, 4m sharing loads, as the TypeScript kernel does it: for m = 1 the
 * values s[j] ... s[j + 6] move through locals; after 4m's last term, m and 2m go on together. */
static long mdev_octaves_grouped(const double *s, long n, double *out) {
  long k = 0, m = 1;
  for (; 4 * m <= (n + 1) / 3; m *= 8) {
    long t1 = n - 3 * m + 2, t2 = n - 6 * m + 2, t4 = n - 12 * m + 2, j = 0;
    double i1 = first_inner(s, m), i2 = first_inner(s, 2 * m), i4 = first_inner(s, 4 * m);
    double a = i1 * i1, b = i2 * i2, c = i4 * i4;
    if (m == 1) {
      double x0 = s[0], x1 = s[1], x2 = s[2], x3 = s[3], x4 = s[4], x5 = s[5];
      for (; j + 1 < t4; j++) {
        double x6 = s[j + 6];
        i1 += x3 - 3 * x2 + 3 * x1 - x0;
        i2 += x6 - 3 * x4 + 3 * x2 - x0;
        i4 += s[j + 12] - 3 * s[j + 8] + 3 * x4 - x0;
        a += i1 * i1;
        b += i2 * i2;
        c += i4 * i4;
        x0 = x1, x1 = x2, x2 = x3, x3 = x4, x4 = x5, x5 = x6;
      }
    } else {
      for (; j + 1 < t4; j++) {
        double s0 = s[j], s2 = s[j + 2 * m], s4 = s[j + 4 * m];
        i1 += s[j + 3 * m] - 3 * s2 + 3 * s[j + m] - s0;
        i2 += s[j + 6 * m] - 3 * s4 + 3 * s2 - s0;
        i4 += s[j + 12 * m] - 3 * s[j + 8 * m] + 3 * s4 - s0;
        a += i1 * i1;
        b += i2 * i2;
        c += i4 * i4;
      }
    }
    j = mdev_pair(s, m, j, t2, &i1, &a, &i2, &b);
    out[k++] = mdev_value(mdev_carry(s, m, j, t1, i1, a), m, t1);
    out[k++] = mdev_value(b, 2 * m, t2);
    out[k++] = mdev_value(c, 4 * m, t4);
  }
  for (; m <= (n + 1) / 3; m *= 2) {
    long terms = n - 3 * m + 2;
    double inner = first_inner(s, m);
    out[k++] = mdev_value(mdev_carry(s, m, 0, terms, inner, inner * inner), m, terms);
  }
  return k;
}

static int compare(const void *a, const void *b) {
  double x = *(const double *)a, y = *(const double *)b;
  return (x > y) - (x < y);
}

int main(int argc, char **argv) {
  if (argc != 4) return 2;
  FILE *f = fopen(argv[1], "rb");
  if (!f) return 3;
  fseek(f, 0, SEEK_END);
  long n = ftell(f) / (long)sizeof(double);
  fseek(f, 0, SEEK_SET);
  double *y = malloc(n * sizeof(double));
  if (!y || fread(y, sizeof(double), n, f) != (size_t)n) return 4;
  fclose(f);
  const char *mode = argv[2];
  int repeats = atoi(argv[3]);
  double *times = malloc(repeats * sizeof(double)), out[64];
  long k = 0;
  for (int r = 0; r < repeats; r++) {
    double t0 = now_ms();
    /* A fresh buffer per run, as the library allocates one per call. */
    double *s = malloc((n + 1) * sizeof(double));
    if (!s) return 5;
    running_sum(y, n, s);
    if (strcmp(mode, "mdev") == 0) k = mdev_octaves(s, n, out);
    else if (strcmp(mode, "mdev-grouped") == 0) k = mdev_octaves_grouped(s, n, out);
    else if (strcmp(mode, "oadev-grouped") == 0) k = oadev_octaves_grouped(s, n, out);
    else k = oadev_octaves(s, n, out);
    free(s);
    times[r] = now_ms() - t0;
  }
  qsort(times, repeats, sizeof(double), compare);
  printf("%.6f", times[repeats / 2]);
  for (long i = 0; i < k; i++) printf(" %.17g", out[i]);
  printf("\n");
  return 0;
}
