/*
 * Reference Modbus TCP server on libmodbus for the rate figures in ../README.md: 20 holding
 * registers (and 20 of each other table) on 127.0.0.1:PORT, any number of connections served
 * from one select() loop, until killed.
 *
 *   refserver PORT
 */
#include <errno.h>
#include <modbus/modbus.h>
#include <stdio.h>
#include <stdlib.h>
#include <sys/select.h>
#include <unistd.h>

int main(int argc, char **argv)
{
    if (argc != 2) {
        fprintf(stderr, "usage: refserver PORT\n");
        return 2;
    }
    modbus_t *ctx = modbus_new_tcp("127.0.0.1", atoi(argv[1]));
    modbus_mapping_t *map = modbus_mapping_new(20, 20, 20, 20);
    if (ctx == NULL || map == NULL) {
        fprintf(stderr, "setup: %s\n", modbus_strerror(errno));
        return 1;
    }
    for (int k = 0; k < 20; k++) {
        map->tab_registers[k] = (uint16_t) (1000 + k);
    }
    int listener = modbus_tcp_listen(ctx, 64);
    if (listener < 0) {
        fprintf(stderr, "listen: %s\n", modbus_strerror(errno));
        return 1;
    }
    fd_set all;
    FD_ZERO(&all);
    FD_SET(listener, &all);
    int top = listener;
    uint8_t query[MODBUS_TCP_MAX_ADU_LENGTH];
    for (;;) {
        fd_set ready = all;
        if (select(top + 1, &ready, NULL, NULL, NULL) < 0) {
            perror("select");
            return 1;
        }
        for (int fd = 0; fd <= top; fd++) {
            if (!FD_ISSET(fd, &ready)) {
                continue;
            }
            if (fd == listener) {
                int c = modbus_tcp_accept(ctx, &listener);
                if (c >= 0) {
                    FD_SET(c, &all);
                    if (c > top) {
                        top = c;
                    }
                }
                continue;
            }
            modbus_set_socket(ctx, fd);
            int n = modbus_receive(ctx, query);
            if (n > 0) {
                modbus_reply(ctx, query, n, map);
            } else if (n < 0) {
                close(fd);
                FD_CLR(fd, &all);
            }
        }
    }
}
