package org.tufa.analysis.report;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.WebSocket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionStage;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;

/**
 * Headless Chromium driven over the Chrome DevTools Protocol (the browser's own remote-control protocol,
 * chromedevtools.github.io/devtools-protocol), with the JDK's WebSocket client: opens a page, clicks at an element's
 * centre with real mouse events, types text as the keyboard would insert it, and lets the page download files into a
 * folder. For tests only; the browser is started with a fresh profile and stopped (with its child processes) on
 * {@link #close}.
 */
final class HeadlessBrowser implements AutoCloseable {

    static final Path CHROMIUM = Path.of(System.getenv().getOrDefault("CHROMIUM", "/usr/bin/chromium"));

    private final Process process;
    private final Path profile;
    private final WebSocket socket;
    private final AtomicInteger ids = new AtomicInteger();
    private final Map<Integer, CompletableFuture<JsonObject>> pending = new ConcurrentHashMap<>();
    private String session;

    static boolean available() {
        return Files.isExecutable(CHROMIUM);
    }

    HeadlessBrowser(Path downloads) throws Exception {
        profile = Files.createTempDirectory("tufa-chromium-");
        process = new ProcessBuilder(CHROMIUM.toString(), "--headless", "--no-sandbox", "--disable-gpu",
                "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run",
                "--user-data-dir=" + profile, "--remote-debugging-port=0", "--window-size=1400,1000", "about:blank")
                .redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
        String url = devToolsUrl(process);
        StringBuilder text = new StringBuilder();
        socket = HttpClient.newHttpClient().newWebSocketBuilder().buildAsync(URI.create(url), new WebSocket.Listener() {
            @Override
            public CompletionStage<?> onText(WebSocket ws, CharSequence data, boolean last) {
                text.append(data);
                if (last) {
                    JsonObject m = JsonParser.parseString(text.toString()).getAsJsonObject();
                    text.setLength(0);
                    if (m.has("id")) {
                        CompletableFuture<JsonObject> f = pending.remove(m.get("id").getAsInt());
                        if (f != null) {
                            f.complete(m);
                        }
                    }
                }
                ws.request(1);
                return null;
            }
        }).get(30, TimeUnit.SECONDS);
        JsonObject allow = new JsonObject();
        allow.addProperty("behavior", "allow");
        allow.addProperty("downloadPath", downloads.toAbsolutePath().toString());
        call("Browser.setDownloadBehavior", allow, false);
        JsonObject target = new JsonObject();
        target.addProperty("url", "about:blank");
        String targetId = call("Target.createTarget", target, false).get("targetId").getAsString();
        JsonObject attach = new JsonObject();
        attach.addProperty("targetId", targetId);
        attach.addProperty("flatten", true);
        session = call("Target.attachToTarget", attach, false).get("sessionId").getAsString();
        call("Page.enable", new JsonObject(), true);
    }

    /** The browser's DevTools address, from the line it prints on start. */
    private static String devToolsUrl(Process p) throws Exception {
        CompletableFuture<String> url = new CompletableFuture<>();
        Thread reader = new Thread(() -> {
            try (BufferedReader r = new BufferedReader(new InputStreamReader(p.getErrorStream(),
                    StandardCharsets.UTF_8))) {
                for (String line; (line = r.readLine()) != null; ) {
                    int at = line.indexOf("ws://");
                    if (line.contains("DevTools listening") && at >= 0) {
                        url.complete(line.substring(at).strip());
                    }
                }
            } catch (IOException e) {
                url.completeExceptionally(e);
            }
            url.completeExceptionally(new IllegalStateException("chromium ended without a DevTools address"));
        }, "chromium-stderr");
        reader.setDaemon(true);
        reader.start();
        return url.get(60, TimeUnit.SECONDS);
    }

    /** One protocol command; its result (an error answer fails the test). */
    JsonObject call(String method, JsonObject params, boolean onPage) throws Exception {
        int id = ids.incrementAndGet();
        JsonObject m = new JsonObject();
        m.addProperty("id", id);
        m.addProperty("method", method);
        m.add("params", params);
        if (onPage) {
            m.addProperty("sessionId", session);
        }
        CompletableFuture<JsonObject> answer = new CompletableFuture<>();
        pending.put(id, answer);
        socket.sendText(m.toString(), true).get(30, TimeUnit.SECONDS);
        JsonObject a = answer.get(60, TimeUnit.SECONDS);
        if (a.has("error")) {
            throw new IllegalStateException(method + ": " + a.get("error"));
        }
        return a.getAsJsonObject("result");
    }

    /** Opens a page and waits until it has loaded. */
    void open(Path page) throws Exception {
        JsonObject nav = new JsonObject();
        nav.addProperty("url", page.toAbsolutePath().toUri().toString());
        call("Page.navigate", nav, true);
        long until = System.nanoTime() + Duration.ofSeconds(30).toNanos();
        while (!"complete".equals(evaluate("document.readyState").getAsString())) {
            if (System.nanoTime() > until) {
                throw new IllegalStateException("page did not load: " + page);
            }
            Thread.sleep(50);
        }
    }

    /** Evaluates a JavaScript expression in the page; its value. */
    JsonElement evaluate(String expression) throws Exception {
        JsonObject p = new JsonObject();
        p.addProperty("expression", expression);
        p.addProperty("returnByValue", true);
        JsonObject r = call("Runtime.evaluate", p, true);
        if (r.has("exceptionDetails")) {
            throw new IllegalStateException("script error: " + r.get("exceptionDetails"));
        }
        JsonObject v = r.getAsJsonObject("result");
        return v.has("value") ? v.get("value") : com.google.gson.JsonNull.INSTANCE;
    }

    /** Clicks the centre of the first element the CSS selector finds, with mouse events, after scrolling to it. */
    void click(String selector) throws Exception {
        JsonElement at = evaluate("(function(){var e=document.querySelector(" + quote(selector) + ");if(!e){return null;}"
                + "e.scrollIntoView({block:'center'});var r=e.getBoundingClientRect();"
                + "return [r.left+r.width/2,r.top+r.height/2];})()");
        if (at.isJsonNull()) {
            throw new IllegalStateException("no element " + selector);
        }
        double x = at.getAsJsonArray().get(0).getAsDouble();
        double y = at.getAsJsonArray().get(1).getAsDouble();
        for (String type : List.of("mouseMoved", "mousePressed", "mouseReleased")) {
            JsonObject e = new JsonObject();
            e.addProperty("type", type);
            e.addProperty("x", x);
            e.addProperty("y", y);
            e.addProperty("button", type.equals("mouseMoved") ? "none" : "left");
            e.addProperty("clickCount", type.equals("mouseMoved") ? 0 : 1);
            call("Input.dispatchMouseEvent", e, true);
        }
    }

    /** Clicks into a text field and types the text (inserted as the keyboard would, firing input events). */
    void type(String selector, String text) throws Exception {
        click(selector);
        JsonObject p = new JsonObject();
        p.addProperty("text", text);
        call("Input.insertText", p, true);
    }

    /** Waits for a downloaded file to be complete in the folder (Chromium renames it from a .crdownload). */
    static Path awaitDownload(Path folder, String name) throws Exception {
        Path file = folder.resolve(name);
        long until = System.nanoTime() + Duration.ofSeconds(30).toNanos();
        while (!Files.isRegularFile(file)) {
            if (System.nanoTime() > until) {
                List<String> seen = new ArrayList<>();
                try (var s = Files.list(folder)) {
                    s.forEach(p -> seen.add(p.getFileName().toString()));
                }
                throw new IllegalStateException("no " + name + " downloaded into " + folder + " (found " + seen + ")");
            }
            Thread.sleep(50);
        }
        return file;
    }

    private static String quote(String s) {
        return new com.google.gson.Gson().toJson(s);
    }

    @Override
    public void close() throws Exception {
        try {
            socket.sendClose(WebSocket.NORMAL_CLOSURE, "").get(5, TimeUnit.SECONDS);
        } catch (Exception ignored) {
            // the browser is stopped below either way
        }
        process.descendants().forEach(ProcessHandle::destroy);
        process.destroy();
        if (!process.waitFor(10, TimeUnit.SECONDS)) {
            process.descendants().forEach(ProcessHandle::destroyForcibly);
            process.destroyForcibly().waitFor(10, TimeUnit.SECONDS);
        }
        try (var walk = Files.walk(profile)) {
            walk.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        }
    }
}
