/*
 * Load client for the Modbus TCP rate figures in ../README.md: CONNECTIONS threads, each with its
 * own libmodbus connection, read REGISTERS holding registers from address 0 of unit 1 back to back
 * for SECONDS seconds. Prints the total and per-connection request rates and the round-trip
 * p50/p99 from a 10 µs histogram. The same client is run against the reference server
 * (refserver.c, libmodbus) and against drumloop, so the two rates compare like with like.
 *
 *   refload HOST PORT SECONDS CONNECTIONS REGISTERS
 */
#include <errno.h>
#include <modbus/modbus.h>
#include <pthread.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#define BUCKETS 10000 /* 10 µs each: 0..100 ms */

struct worker {
    const char *host;
    int port;
    double seconds;
    int registers;
    long requests;
    long errors;
    long hist[BUCKETS];
    pthread_t thread;
};

static double now_s(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return ts.tv_sec + ts.tv_nsec * 1e-9;
}

static void *run(void *arg)
{
    struct worker *w = arg;
    uint16_t regs[125];
    modbus_t *ctx = modbus_new_tcp(w->host, w->port);
    if (ctx == NULL || modbus_connect(ctx) == -1) {
        fprintf(stderr, "connect: %s\n", modbus_strerror(errno));
        w->errors = -1;
        return NULL;
    }
    modbus_set_slave(ctx, 1);
    double end = now_s() + w->seconds;
    for (;;) {
        double t0 = now_s();
        if (t0 >= end) {
            break;
        }
        if (modbus_read_registers(ctx, 0, w->registers, regs) != w->registers) {
            w->errors++;
            continue;
        }
        long b = (long) ((now_s() - t0) * 1e5);
        w->hist[b < BUCKETS ? b : BUCKETS - 1]++;
        w->requests++;
    }
    modbus_close(ctx);
    modbus_free(ctx);
    return NULL;
}

static double percentile(const long *hist, long n, double p)
{
    long rank = (long) (p * n + 0.999999), seen = 0;
    for (int b = 0; b < BUCKETS; b++) {
        seen += hist[b];
        if (seen >= rank) {
            return (b + 1) * 0.01;
        }
    }
    return BUCKETS * 0.01;
}

int main(int argc, char **argv)
{
    if (argc != 6) {
        fprintf(stderr, "usage: refload HOST PORT SECONDS CONNECTIONS REGISTERS\n");
        return 2;
    }
    int n = atoi(argv[4]);
    int registers = atoi(argv[5]);
    if (n < 1 || n > 64 || registers < 1 || registers > 125) {
        fprintf(stderr, "CONNECTIONS 1..64, REGISTERS 1..125\n");
        return 2;
    }
    struct worker *ws = calloc(n, sizeof *ws);
    for (int k = 0; k < n; k++) {
        ws[k].host = argv[1];
        ws[k].port = atoi(argv[2]);
        ws[k].seconds = atof(argv[3]);
        ws[k].registers = registers;
        pthread_create(&ws[k].thread, NULL, run, &ws[k]);
    }
    long total = 0, errors = 0;
    static long all[BUCKETS];
    for (int k = 0; k < n; k++) {
        pthread_join(ws[k].thread, NULL);
        total += ws[k].requests;
        errors += ws[k].errors;
        for (int b = 0; b < BUCKETS; b++) {
            all[b] += ws[k].hist[b];
        }
    }
    double seconds = atof(argv[3]);
    printf("%d connection(s), %d registers: %.0f requests/s in total", n, registers, total / seconds);
    if (n > 1) {
        printf(" (per connection");
        for (int k = 0; k < n; k++) {
            printf(" %.0f", ws[k].requests / seconds);
        }
        printf(")");
    }
    printf(", round trip p50 %.2f ms p99 %.2f ms, errors %ld\n", percentile(all, total, 0.50),
           percentile(all, total, 0.99), errors);
    free(ws);
    return errors == 0 ? 0 : 1;
}
