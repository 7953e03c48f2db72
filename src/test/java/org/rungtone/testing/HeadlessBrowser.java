package org.rungtone.testing;

import static org.junit.jupiter.api.Assertions.fail;

import com.google.gson.Gson;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.jsoup.parser.Parser;
import org.junit.jupiter.api.Assumptions;

/**
 * Renders a page in Debian's headless {@code chromium} at given widths and reports what a reader would
 * see go wrong: elements reaching past the page's edge outside a scroll box, and images that did not load.
 *
 * <p>Chromium's headless window is never narrower than 500 px, so the page is shown in iframes of exactly
 * the widths asked for, side by side in a harness page written next to it (so its relative links and
 * images resolve as they would for a reader); a script in the harness ({@code browser-check.js}) measures
 * each frame once everything has loaded and writes the result into the DOM, which chromium prints. A
 * missing chromium skips the calling test with a printed reason, unless RUNGTONE_REQUIRE_CROSS is set (CI),
 * in which case it fails it.
 */
public final class HeadlessBrowser {
    private static final String PROGRAM = "chromium";
    private static final int GAP_PX = 20;
    private static final int HEIGHT_PX = 2400;
    private static final Pattern RESULT = Pattern.compile(
            "<pre id=\"rungtone-browser-check\">(.*?)</pre>", Pattern.DOTALL);

    private HeadlessBrowser() {
    }

    /**
     * What one frame showed.
     *
     * @param width the frame's viewport width, CSS pixels
     * @param scrolling the elements in a scroll box (class {@code scroll}) wider than the box
     * @param scrollWidth the page's scroll width: more than {@code width} when anything sticks out
     * @param images the number of images on the page
     * @param overflowing the outermost elements past the page's edges outside a scroll box
     * @param brokenImages the images that did not load
     */
    public record Frame(int width, List<String> scrolling, int scrollWidth, int images, List<String> overflowing,
            List<String> brokenImages) {
    }

    /** Skips (or, with RUNGTONE_REQUIRE_CROSS, fails) the calling test when chromium is absent. */
    public static void require() {
        if (CToolchain.available(PROGRAM)) {
            return;
        }
        String required = System.getenv("RUNGTONE_REQUIRE_CROSS");
        if (required != null && !required.isEmpty()) {
            fail(PROGRAM + " is not installed but RUNGTONE_REQUIRE_CROSS is set");
        }
        String reason = PROGRAM + " not found on PATH; skipping (set RUNGTONE_REQUIRE_CROSS to make this fail)";
        System.err.println("[rungtone browser tests] " + reason);
        Assumptions.assumeTrue(false, reason);
    }

    /**
     * Renders {@code page} at each of {@code widths} in one chromium run and saves a screenshot of all of
     * them side by side.
     *
     * @return one frame per width, in order
     */
    public static List<Frame> render(Path page, List<Integer> widths, Path screenshot) throws IOException {
        Path dir = page.toAbsolutePath().getParent();
        Path harness = dir.resolve(".browser-check.html");
        Files.writeString(harness, harness(page.getFileName().toString(), widths), StandardCharsets.UTF_8);
        Path profile = Files.createTempDirectory("rungtone-chromium");
        Files.createDirectories(screenshot.toAbsolutePath().getParent());
        int windowWidth = widths.stream().mapToInt(Integer::intValue).sum() + GAP_PX * (widths.size() + 1);
        CToolchain.Result r;
        try {
            r = CToolchain.exec(dir, List.of(PROGRAM, "--headless=new", "--no-sandbox", "--disable-gpu",
                    "--hide-scrollbars", "--allow-file-access-from-files", "--no-first-run",
                    "--user-data-dir=" + profile, "--window-size=" + windowWidth + "," + HEIGHT_PX,
                    "--screenshot=" + screenshot.toAbsolutePath(), "--dump-dom", harness.toUri().toString()));
        } finally {
            delete(profile);
            Files.delete(harness);
        }
        Matcher m = RESULT.matcher(r.output());
        if (r.exitCode() != 0 || !m.find()) {
            fail("chromium gave no result (exit " + r.exitCode() + "):\n" + r.output());
        }
        Frame[] frames = new Gson().fromJson(Parser.unescapeEntities(m.group(1), false), Frame[].class);
        return new ArrayList<>(Arrays.asList(frames));
    }

    private static void delete(Path tree) throws IOException {
        try (var files = Files.walk(tree)) {
            for (Path p : files.sorted(java.util.Comparator.reverseOrder()).toList()) {
                Files.deleteIfExists(p);
            }
        }
    }

    private static String harness(String page, List<Integer> widths) throws IOException {
        StringBuilder b = new StringBuilder("<!DOCTYPE html>\n<html><head><meta charset=\"utf-8\"></head>\n"
                + "<body style=\"margin:0;display:flex;align-items:flex-start;gap:" + GAP_PX + "px;padding:0 "
                + GAP_PX + "px;background:#888\">\n");
        for (int w : widths) {
            b.append("<iframe src=\"").append(page).append("\" style=\"width:").append(w).append("px;height:")
                    .append(HEIGHT_PX).append("px;border:0;background:#fff;flex:none\"></iframe>\n");
        }
        try (InputStream in = HeadlessBrowser.class.getResourceAsStream("browser-check.js")) {
            if (in == null) {
                throw new IllegalStateException("browser-check.js is missing from the test resources");
            }
            b.append("<script>\n").append(new String(in.readAllBytes(), StandardCharsets.UTF_8)).append("</script>\n");
        }
        return b.append("</body></html>\n").toString();
    }
}
