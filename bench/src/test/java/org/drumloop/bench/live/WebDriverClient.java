package org.drumloop.bench.live;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Base64;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Drives Debian's headless chromium through chromedriver over the W3C WebDriver HTTP protocol
 * (https://www.w3.org/TR/webdriver2/) with the JDK HTTP client: no browser download at test time.
 * chromedriver is started on port 0 and reports the port it took; everything stays on loopback.
 */
public final class WebDriverClient implements AutoCloseable {
    static final Path CHROMIUM = Path.of("/usr/bin/chromium");
    static final Path CHROMEDRIVER = Path.of("/usr/bin/chromedriver");
    /** W3C WebDriver: the key under which an element reference is returned. */
    static final String ELEMENT_KEY = "element-6066-11e4-a23c-4b5e-a5b8-5ed6c5cf6b61";
    private static final Pattern PORT = Pattern.compile("started successfully on port (\\d+)");

    private final Process driver;
    private final HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(10)).build();
    private final String base;
    private final String session;

    /** Fails (not skips) when the browser is missing: the project's test command installs it. */
    static void requireBrowser() {
        if (!Files.isExecutable(CHROMIUM) || !Files.isExecutable(CHROMEDRIVER)) {
            throw new AssertionError("The browser test needs Debian's chromium and chromedriver (" + CHROMIUM
                    + ", " + CHROMEDRIVER + "): apt-get install chromium chromium-driver");
        }
    }

    public WebDriverClient(Path userDataDir, int width, int height) throws IOException, InterruptedException {
        requireBrowser();
        driver = new ProcessBuilder(CHROMEDRIVER.toString(), "--port=0").redirectErrorStream(true).start();
        BufferedReader out = new BufferedReader(new InputStreamReader(driver.getInputStream(), StandardCharsets.UTF_8));
        int port = -1;
        StringBuilder seen = new StringBuilder();
        for (String line = out.readLine(); line != null; line = out.readLine()) {
            seen.append(line).append('\n');
            Matcher m = PORT.matcher(line);
            if (m.find()) {
                port = Integer.parseInt(m.group(1));
                break;
            }
        }
        if (port < 0) {
            driver.destroy();
            throw new IOException("chromedriver did not start:\n" + seen);
        }
        Thread drain = new Thread(() -> {
            try {
                while (out.readLine() != null) {
                    // keep the pipe empty
                }
            } catch (IOException e) {
                // process ended
            }
        }, "chromedriver-output");
        drain.setDaemon(true);
        drain.start();
        base = "http://127.0.0.1:" + port;
        List<String> args = List.of("--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run",
                "--disable-background-networking", "--disable-component-update", "--disable-sync",
                "--disable-dev-shm-usage", "--user-data-dir=" + userDataDir, "--window-size=" + width + "," + height);
        StringBuilder a = new StringBuilder();
        for (String s : args) {
            a.append(a.length() == 0 ? "" : ",").append(MiniJson.quote(s));
        }
        String caps = "{\"capabilities\":{\"alwaysMatch\":{\"browserName\":\"chrome\",\"unhandledPromptBehavior\":\"ignore\","
                + "\"goog:chromeOptions\":{\"binary\":" + MiniJson.quote(CHROMIUM.toString()) + ",\"args\":[" + a + "]}}}}";
        Map<String, Object> v = MiniJson.obj(call("POST", "/session", caps));
        session = (String) v.get("sessionId");
        call("POST", "/session/" + session + "/timeouts", "{\"script\":30000,\"pageLoad\":30000,\"implicit\":0}");
    }

    Object call(String method, String path, String body) throws IOException, InterruptedException {
        HttpRequest.Builder b = HttpRequest.newBuilder(URI.create(base + path)).timeout(Duration.ofSeconds(60));
        if ("POST".equals(method)) {
            b.header("Content-Type", "application/json").POST(HttpRequest.BodyPublishers.ofString(body));
        } else if ("DELETE".equals(method)) {
            b.DELETE();
        } else {
            b.GET();
        }
        HttpResponse<String> r = http.send(b.build(), HttpResponse.BodyHandlers.ofString());
        Object value = MiniJson.obj(MiniJson.parse(r.body())).get("value");
        if (r.statusCode() != 200) {
            throw new IOException("WebDriver " + method + " " + path + " -> " + r.statusCode() + ": " + r.body());
        }
        return value;
    }

    private String s(String rest) {
        return "/session/" + session + rest;
    }

    public void navigate(String url) throws IOException, InterruptedException {
        call("POST", s("/url"), "{\"url\":" + MiniJson.quote(url) + "}");
    }

    String find(String css) throws IOException, InterruptedException {
        Object v = call("POST", s("/element"), "{\"using\":\"css selector\",\"value\":" + MiniJson.quote(css) + "}");
        Map<String, Object> ref = MiniJson.obj(v);
        // W3C WebDriver §12.2: the reference is the single member under the web element identifier
        return (String) (ref.containsKey(ELEMENT_KEY) ? ref.get(ELEMENT_KEY) : ref.values().iterator().next());
    }

    void click(String css) throws IOException, InterruptedException {
        call("POST", s("/element/" + find(css) + "/click"), "{}");
    }

    /** Replace an input's content by typing into it. */
    void type(String css, String text) throws IOException, InterruptedException {
        String el = find(css);
        call("POST", s("/element/" + el + "/clear"), "{}");
        call("POST", s("/element/" + el + "/value"), "{\"text\":" + MiniJson.quote(text) + "}");
    }

    String text(String css) throws IOException, InterruptedException {
        return (String) call("GET", s("/element/" + find(css) + "/text"), null);
    }

    /** Run a synchronous script; returns its (JSON-decoded) result. */
    Object script(String js, String argsJson) throws IOException, InterruptedException {
        return call("POST", s("/execute/sync"), "{\"script\":" + MiniJson.quote(js) + ",\"args\":" + argsJson + "}");
    }

    /**
     * Wait inside the page until {@code predicateJs} (an expression over {@code document}) is
     * truthy, polling in the browser every 50 ms; fails after the session's script timeout.
     */
    Object waitFor(String predicateJs) throws IOException, InterruptedException {
        String js = "const done = arguments[arguments.length - 1];"
                + "const f = () => { let v; try { v = (" + predicateJs + "); } catch (e) { v = null; }"
                + " if (v) { done(v); } else { setTimeout(f, 50); } }; f();";
        return call("POST", s("/execute/async"), "{\"script\":" + MiniJson.quote(js) + ",\"args\":[]}");
    }

    String alertText() throws IOException, InterruptedException {
        return (String) call("GET", s("/alert/text"), null);
    }

    void acceptAlert() throws IOException, InterruptedException {
        call("POST", s("/alert/accept"), "{}");
    }

    void dismissAlert() throws IOException, InterruptedException {
        call("POST", s("/alert/dismiss"), "{}");
    }

    /**
     * Print the current page to PDF (W3C WebDriver "Print Page", section 18.1) on paper of the given
     * size [cm], with backgrounds and without the browser's own header and footer.
     */
    public byte[] printPdf(double widthCm, double heightCm) throws IOException, InterruptedException {
        String body = String.format(java.util.Locale.ROOT,
                "{\"page\":{\"width\":%.2f,\"height\":%.2f},\"background\":true,\"shrinkToFit\":false}", widthCm, heightCm);
        return Base64.getDecoder().decode((String) call("POST", s("/print"), body));
    }

    byte[] screenshotPng() throws IOException, InterruptedException {
        return Base64.getDecoder().decode((String) call("GET", s("/screenshot"), null));
    }

    @Override
    public void close() throws IOException {
        try {
            call("DELETE", s(""), null);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        } finally {
            driver.destroy();
            try {
                driver.waitFor();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
        }
    }
}
