package org.drumloop.bench.live;

import com.sun.net.httpserver.HttpExchange;
import com.sun.net.httpserver.HttpServer;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.net.InetAddress;
import java.net.InetSocketAddress;
import java.net.URI;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Map;
import java.util.UUID;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * The live page's web server (JDK {@code com.sun.net.httpserver}): static page files from the
 * class path, a server-sent-event stream of values, and a small JSON command API.
 *
 * <pre>
 * GET  /                 the page (index.html, live.css, live.js, all from resources/live)
 * GET  /api/state        info, trend history, recent events and the latest values (JSON)
 * GET  /api/stream       text/event-stream, one message every broadcast period
 * POST /api/command      one JSON command (see {@link CommandParser}); 400 + message when bad
 * GET  /api/scenario     the session so far as a scenario file (text/plain, download)
 * </pre>
 * Binds 127.0.0.1 unless told otherwise. Commands must be {@code application/json} and, when the
 * browser sends an Origin, come from this server's own origin, so another web site open in the
 * same browser cannot drive the bench.
 */
public final class LiveServer implements AutoCloseable {
    /** Broadcast period: 10 messages a second. */
    public static final long DEFAULT_BROADCAST_MS = 100;
    static final int MAX_BODY_BYTES = 4096;
    static final double SPEED_MIN = 0.1;
    static final double SPEED_MAX = 100.0;
    private static final List<String> STATIC = List.of("index.html", "live.css", "live.js");

    private final LiveLoop loop;
    private final CommandParser parser;
    private final Broadcaster broadcaster;
    private final Thread broadcastThread;
    private final HttpServer http;
    private final ExecutorService executor;
    private final AtomicInteger clients = new AtomicInteger();
    private final long broadcastPeriodMs;

    /**
     * Serve {@code loop} on {@code bindAddress:port} (port 0 picks a free one). The loop is not
     * started here.
     */
    public LiveServer(LiveLoop loop, InetAddress bindAddress, int port, long broadcastMs) throws IOException {
        this.loop = loop;
        this.broadcastPeriodMs = broadcastMs;
        this.parser = new CommandParser(loop.session().info());
        this.broadcaster = new Broadcaster(loop, broadcastMs, UUID.randomUUID().toString());
        this.http = HttpServer.create(new InetSocketAddress(bindAddress, port), 64);
        this.executor = Executors.newCachedThreadPool(r -> {
            Thread t = new Thread(r, "live-http");
            t.setDaemon(true);
            return t;
        });
        http.setExecutor(executor);
        http.createContext("/", this::page);
        http.createContext("/api/state", ex -> guarded(ex, this::state));
        http.createContext("/api/stream", ex -> guarded(ex, this::stream));
        http.createContext("/api/command", ex -> guarded(ex, this::command));
        http.createContext("/api/scenario", ex -> guarded(ex, this::scenario));
        this.broadcastThread = new Thread(broadcaster, "live-broadcast");
        broadcastThread.setDaemon(true);
    }

    /** Serve on 127.0.0.1. */
    public static LiveServer onLoopback(LiveLoop loop, int port) throws IOException {
        return new LiveServer(loop, InetAddress.getLoopbackAddress(), port, DEFAULT_BROADCAST_MS);
    }

    public void start() {
        broadcaster.tick();
        loop.setPublishListener(broadcastThread, broadcastPeriodMs * 1_000_000L);
        broadcastThread.start();
        http.start();
    }

    public int port() {
        return http.getAddress().getPort();
    }

    public URI uri() {
        return URI.create("http://" + http.getAddress().getAddress().getHostAddress() + ":" + port() + "/");
    }

    /** Number of open event streams. */
    public int clients() {
        return clients.get();
    }

    @Override
    public void close() {
        loop.setPublishListener(null, Long.MAX_VALUE);
        broadcaster.stop();
        broadcastThread.interrupt();
        http.stop(0);
        executor.shutdownNow();
    }

    // ---- handlers --------------------------------------------------------------------------

    private interface Handler {
        void handle(HttpExchange ex) throws IOException;
    }

    private static void guarded(HttpExchange ex, Handler h) throws IOException {
        try (ex) {
            h.handle(ex);
        } catch (IOException e) {
            // the peer went away; nothing to tell it
        }
    }

    private void page(HttpExchange ex) throws IOException {
        try (ex) {
            String path = ex.getRequestURI().getPath();
            String name = "/".equals(path) ? "index.html" : path.substring(1);
            if (!"GET".equals(ex.getRequestMethod()) && !"HEAD".equals(ex.getRequestMethod())) {
                send(ex, 405, "text/plain", "method not allowed\n");
                return;
            }
            if (!STATIC.contains(name)) {
                send(ex, 404, "text/plain", "not found\n");
                return;
            }
            byte[] body;
            try (InputStream in = LiveServer.class.getResourceAsStream("/live/" + name)) {
                if (in == null) {
                    send(ex, 500, "text/plain", "page resource missing from the class path: live/" + name + "\n");
                    return;
                }
                body = in.readAllBytes();
            }
            String type = name.endsWith(".html") ? "text/html; charset=utf-8"
                    : name.endsWith(".css") ? "text/css; charset=utf-8" : "text/javascript; charset=utf-8";
            send(ex, 200, type, body);
        }
    }

    private void state(HttpExchange ex) throws IOException {
        if (!"GET".equals(ex.getRequestMethod())) {
            send(ex, 405, "application/json", "{\"error\":\"use GET\"}");
            return;
        }
        send(ex, 200, "application/json", broadcaster.state());
    }

    private void stream(HttpExchange ex) throws IOException {
        ex.getResponseHeaders().set("Content-Type", "text/event-stream; charset=utf-8");
        ex.getResponseHeaders().set("Cache-Control", "no-store");
        ex.getResponseHeaders().set("X-Accel-Buffering", "no");
        ex.sendResponseHeaders(200, 0);
        clients.incrementAndGet();
        try {
            OutputStream out = ex.getResponseBody();
            // reconnect a second after the stream breaks (browsers default to ~3 s)
            out.write("retry: 1000\n\n".getBytes(StandardCharsets.UTF_8));
            out.flush();
            long after = broadcaster.seq() - 1;
            while (true) {
                Broadcaster.Frame f = broadcaster.await(after);
                if (f == null) {
                    return;
                }
                after = f.seq();
                out.write(f.bytes());
                out.flush();
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        } finally {
            clients.decrementAndGet();
        }
    }

    private void command(HttpExchange ex) throws IOException {
        if (!"POST".equals(ex.getRequestMethod())) {
            send(ex, 405, "application/json", error("use POST with a JSON body"));
            return;
        }
        String type = ex.getRequestHeaders().getFirst("Content-Type");
        if (type == null || !type.toLowerCase(java.util.Locale.ROOT).startsWith("application/json")) {
            send(ex, 415, "application/json", error("Content-Type must be application/json"));
            return;
        }
        String origin = ex.getRequestHeaders().getFirst("Origin");
        String host = ex.getRequestHeaders().getFirst("Host");
        if (origin != null && (host == null || !origin.equals("http://" + host))) {
            send(ex, 403, "application/json", error("commands are accepted from this page only"));
            return;
        }
        byte[] body = readLimited(ex.getRequestBody());
        if (body == null) {
            send(ex, 413, "application/json", error("request body larger than " + MAX_BODY_BYTES + " bytes"));
            return;
        }
        Map<String, Object> m;
        try {
            m = Json.parseObject(new String(body, StandardCharsets.UTF_8));
        } catch (Json.ParseException e) {
            send(ex, 400, "application/json", error("malformed JSON: " + e.getMessage()));
            return;
        }
        Object cmd = m.get("cmd");
        try {
            if (loop.session().info().hardware() && ("pause".equals(cmd) || "resume".equals(cmd) || "speed".equals(cmd))) {
                // the firmware keeps scanning the rig in real time: pausing it would freeze its outputs
                throw new CommandParser.BadCommand(cmd + ": not available on real hardware: the firmware scans in real time");
            }
            if ("pause".equals(cmd) || "resume".equals(cmd)) {
                if (m.size() != 1) {
                    throw new CommandParser.BadCommand("\"" + cmd + "\" takes no other members");
                }
                loop.setPaused("pause".equals(cmd));
                send(ex, 200, "application/json", "{\"ok\":true}");
                return;
            }
            if ("speed".equals(cmd)) {
                Object v = m.get("speed");
                if (m.size() != 2 || !(v instanceof Double)) {
                    throw new CommandParser.BadCommand("speed: give {\"cmd\":\"speed\",\"speed\":N}");
                }
                double s = (Double) v;
                if (!(s >= SPEED_MIN && s <= SPEED_MAX)) {
                    throw new CommandParser.BadCommand("speed: " + LiveAction.fmt(s) + " is out of range "
                            + LiveAction.fmt(SPEED_MIN) + " to " + LiveAction.fmt(SPEED_MAX));
                }
                loop.setSpeed(s);
                send(ex, 200, "application/json", "{\"ok\":true}");
                return;
            }
            LiveAction a = parser.parse(m);
            try {
                loop.session().check(a);
            } catch (IllegalArgumentException e) {
                throw new CommandParser.BadCommand(e.getMessage());
            }
            if (!loop.submit(a)) {
                send(ex, 503, "application/json", error("too many commands waiting; try again"));
                return;
            }
            StringBuilder b = new StringBuilder("{\"ok\":true,\"statement\":");
            Json.str(b, a.scenarioStatement()).append('}');
            send(ex, 200, "application/json", b.toString());
        } catch (CommandParser.BadCommand e) {
            send(ex, 400, "application/json", error(e.getMessage()));
        }
    }

    private void scenario(HttpExchange ex) throws IOException {
        if (!"GET".equals(ex.getRequestMethod())) {
            send(ex, 405, "text/plain", "use GET\n");
            return;
        }
        ex.getResponseHeaders().set("Content-Disposition", "attachment; filename=\"live-session.scenario\"");
        send(ex, 200, "text/plain; charset=utf-8", scenarioText());
    }

    /** The session so far as a scenario file that replays it. */
    public String scenarioText() throws IOException {
        try {
            List<String> lines = loop.scenarioLines().get(5, java.util.concurrent.TimeUnit.SECONDS);
            return String.join("\n", lines) + "\n";
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted while the loop wrote the scenario", e);
        } catch (java.util.concurrent.ExecutionException | java.util.concurrent.TimeoutException e) {
            throw new IOException("the loop did not hand over the scenario: " + e, e);
        }
    }

    private static String error(String message) {
        StringBuilder b = new StringBuilder("{\"error\":");
        return Json.str(b, message).append('}').toString();
    }

    private static byte[] readLimited(InputStream in) throws IOException {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        byte[] buf = new byte[1024];
        int n;
        while ((n = in.read(buf)) > 0) {
            out.write(buf, 0, n);
            if (out.size() > MAX_BODY_BYTES) {
                return null;
            }
        }
        return out.toByteArray();
    }

    private static void send(HttpExchange ex, int status, String type, String body) throws IOException {
        send(ex, status, type, body.getBytes(StandardCharsets.UTF_8));
    }

    private static void send(HttpExchange ex, int status, String type, byte[] body) throws IOException {
        ex.getResponseHeaders().set("Content-Type", type);
        ex.getResponseHeaders().set("Cache-Control", "no-store");
        ex.getResponseHeaders().set("X-Content-Type-Options", "nosniff");
        boolean head = "HEAD".equals(ex.getRequestMethod());
        ex.sendResponseHeaders(status, head ? -1 : (body.length == 0 ? -1 : body.length));
        if (!head && body.length > 0) {
            try (OutputStream os = ex.getResponseBody()) {
                os.write(body);
            }
        }
    }
}
