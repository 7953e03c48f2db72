package org.rungtone.report;

import java.net.URI;
import java.net.URISyntaxException;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;

/**
 * How a page names the files it lists: relative to the page's folder, with a relative link, when the file
 * lies inside that folder (so the page and its files can move together); as given, without a link,
 * otherwise.
 */
final class PageLinks {
    private final Optional<Path> base;

    /** Links relative to {@code base}, the folder the page is written to (none when the page is not a file). */
    PageLinks(Optional<Path> base) {
        this.base = base;
    }

    /** The file as the page shows it: "door_chime/preview.wav", or the path as given. */
    String shown(Path f) {
        return relative(f).orElse(f.toString());
    }

    /** The template's view of a file: {@code text}, {@code href} and {@code hasHref}. */
    Map<String, Object> link(Path f) {
        Optional<String> rel = relative(f);
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("text", rel.orElse(f.toString()));
        m.put("hasHref", rel.isPresent());
        m.put("href", rel.map(PageLinks::href).orElse(""));
        return m;
    }

    private Optional<String> relative(Path f) {
        if (base.isPresent()) {
            Path abs = f.toAbsolutePath().normalize();
            if (abs.startsWith(base.get()) && !abs.equals(base.get())) {
                return Optional.of(base.get().relativize(abs).toString().replace('\\', '/'));
            }
        }
        return Optional.empty();
    }

    /** A relative path as a URI reference: reserved characters escaped, never read as a scheme. */
    static String href(String relative) {
        String path = relative.contains(":") && !relative.startsWith("./") ? "./" + relative : relative;
        try {
            return new URI(null, null, path, null).toASCIIString();
        } catch (URISyntaxException e) {
            throw new IllegalStateException("cannot make a link to " + relative, e);
        }
    }
}
