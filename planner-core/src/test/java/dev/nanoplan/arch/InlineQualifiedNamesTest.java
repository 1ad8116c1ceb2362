package dev.nanoplan.arch;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * Main sources name other nanoplan types through imports, never inline as
 * {@code dev.nanoplan.x.Y}: an import shows every dependency between packages at the top of a file
 * (the layer rules of {@link CoreArchitectureTest} see both, a reader only the imports).
 */
class InlineQualifiedNamesTest {

    /**
     * Files allowed to hold inline names (none today; a folder entry ending in / would cover its
     * files): keep it empty unless a generated source needs an exception.
     */
    private static final List<String> ALLOWED = List.of();

    private static final Pattern INLINE = Pattern.compile("(?<![\\w.])dev\\.nanoplan(?:\\.[a-z_][a-z0-9_]*)+\\.[A-Z]");

    /** The repository root (tests run in planner-core). */
    private static Path root() {
        Path here = Path.of("").toAbsolutePath();
        return Files.isDirectory(here.resolve("planner-core")) ? here : here.getParent();
    }

    @Test
    void mainSourcesImportInsteadOfNamingTypesInline() throws IOException {
        Path root = root();
        List<Path> files = new ArrayList<>();
        for (String module : List.of("planner-core", "planner-ui")) {
            try (Stream<Path> s = Files.walk(root.resolve(module).resolve("src/main/java"))) {
                s.filter(p -> p.toString().endsWith(".java")).forEach(files::add);
            }
        }
        // guards against a vacuous pass when run from an unexpected directory
        assertThat(files).hasSizeGreaterThan(100);
        List<String> found = new ArrayList<>();
        for (Path f : files) {
            String rel = root.relativize(f).toString().replace('\\', '/');
            if (ALLOWED.stream().anyMatch(a -> a.endsWith("/") ? rel.startsWith(a) : rel.equals(a))) {
                continue;
            }
            String[] lines = codeOnly(Files.readString(f, StandardCharsets.UTF_8)).split("\n", -1);
            for (int i = 0; i < lines.length; i++) {
                String line = lines[i].strip();
                if (line.startsWith("import ") || line.startsWith("package ")) {
                    continue;
                }
                Matcher m = INLINE.matcher(lines[i]);
                if (m.find()) {
                    found.add(rel + ":" + (i + 1) + ": " + line);
                }
            }
        }
        assertThat(found).as("inline fully-qualified dev.nanoplan names; import them instead").isEmpty();
    }

    @Test
    void theScannerSeesCodeButNotCommentsOrStrings() {
        String src = "class A {\n  // dev.nanoplan.x.Y in a comment\n  /** {@link dev.nanoplan.x.Y} */\n"
                + "  String s = \"dev.nanoplan.x.Y\";\n  Object o = dev.nanoplan.x.Y.of();\n}\n";
        String[] lines = codeOnly(src).split("\n", -1);
        // line 5 holds the only inline name in code
        assertThat(INLINE.matcher(lines[4]).find()).isTrue();
        assertThat(INLINE.matcher(lines[1] + lines[2] + lines[3]).find()).isFalse();
    }

    /** {@code src} with comments and the insides of string and char literals blanked, line breaks kept. */
    static String codeOnly(String src) {
        StringBuilder out = new StringBuilder(src.length());
        int i = 0;
        int n = src.length();
        while (i < n) {
            char c = src.charAt(i);
            if (src.startsWith("//", i)) {
                while (i < n && src.charAt(i) != '\n') {
                    i++;
                }
            } else if (src.startsWith("/*", i)) {
                int end = src.indexOf("*/", i + 2);
                end = end < 0 ? n : end + 2;
                src.substring(i, end).chars().filter(ch -> ch == '\n').forEach(ch -> out.append('\n'));
                i = end;
            } else if (c == '"' || c == '\'') {
                boolean block = src.startsWith("\"\"\"", i);
                String quote = block ? "\"\"\"" : String.valueOf(c);
                int j = i + quote.length();
                while (j < n && !src.startsWith(quote, j)) {
                    if (src.charAt(j) == '\n') {
                        out.append('\n');
                    }
                    j += src.charAt(j) == '\\' ? 2 : 1;
                }
                out.append(quote).append(quote);
                i = Math.min(n, j + quote.length());
            } else {
                out.append(c);
                i++;
            }
        }
        return out.toString();
    }
}
