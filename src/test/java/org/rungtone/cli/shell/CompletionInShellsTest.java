package org.rungtone.cli.shell;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.rungtone.cli.Main;
import org.rungtone.testing.CToolchain;

/**
 * The completion scripts in the real shells: each is loaded into bash, zsh or fish and asked what completes a
 * few command lines, in a folder holding a sound, a script, a project file and a ladder file. bash is always
 * there; zsh and fish skip when absent unless RUNGTONE_REQUIRE_CROSS is set (CI installs them).
 */
class CompletionInShellsTest {
    /** Command lines up to the cursor, and the completions every shell must offer for them (sorted). */
    private static final Map<String, String> CASES = cases();

    @TempDir
    Path dir;

    private static Map<String, String> cases() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("rungtone ", "build calibrate completion demo help init ladder survey");
        m.put("rungtone bu", "build");
        m.put("rungtone build --dither ", "none rpdf tpdf");
        m.put("rungtone build --di", "--dither");
        m.put("rungtone survey --shaping ", "first none second");
        m.put("rungtone build --storage ", "packed tread2 tread3 tread4 unpacked");
        m.put("rungtone survey --storage ", "tread2 tread3 tread4");
        m.put("rungtone build --engine ", "clip dds loop sweep");
        m.put("rungtone build --target ", "avr cortexm generic rp2040");
        m.put("rungtone build --compensation ", "off on");
        m.put("rungtone ladder --topology ", "custom r2r weighted");
        m.put("rungtone init --topology ", "r2r weighted");
        m.put("rungtone ladder --series E1", "E12 E192");
        m.put("rungtone calibrate plan --timer ", "alarm general16 general32 systick timer0 timer1 timer2");
        m.put("rungtone calibrate ", "fit listen plan simulate");
        m.put("rungtone build gre", "greenhouse.toml");
        m.put("rungtone survey ala", "alarm.rung");
        m.put("rungtone build --ladder bo", "board.toml");
        m.put("rungtone build door-chime.wav --rate 16k --keep", "--keep-dc");
        m.put("rungtone build --bits ", "");
        m.put("rungtone completion ", "bash fish zsh");
        m.put("rungtone help su", "survey");
        return m;
    }

    @BeforeEach
    void files() throws IOException {
        for (String name : List.of("door-chime.wav", "alarm.rung", "greenhouse.toml", "board.toml")) {
            Files.writeString(dir.resolve(name), "");
        }
    }

    private Path script(Shell shell, String name) throws IOException {
        Path file = dir.resolve(name);
        Files.writeString(file, shell.script(Main.newCommandLine(), "test"));
        return file;
    }

    /** bash: the completion function called with the words bash would give it (it splits at '='). */
    @Test
    void bashCompletesCommandsOptionsChoicesAndFiles() throws IOException {
        Path script = script(Shell.BASH, ".completion.bash");
        Files.write(dir.resolve(".lines"), CASES.keySet());
        Files.writeString(dir.resolve(".harness.bash"), """
                source "$1"
                complete -p rungtone > /dev/null || exit 1
                while IFS= read -r line; do
                    COMP_WORDS=()
                    read -ra typed <<< "$line"
                    for w in "${typed[@]}"; do
                        if [[ "$w" == *=* ]]; then
                            COMP_WORDS+=("${w%%=*}" "=")
                            [ -n "${w#*=}" ] && COMP_WORDS+=("${w#*=}")
                        else
                            COMP_WORDS+=("$w")
                        fi
                    done
                    [[ "$line" == *" " ]] && COMP_WORDS+=("")
                    COMP_CWORD=$(( ${#COMP_WORDS[@]} - 1 ))
                    COMP_LINE="$line"
                    COMP_POINT=${#line}
                    COMPREPLY=()
                    _rungtone
                    echo "$line|${COMPREPLY[*]}"
                done < .lines
                """);
        String out = CToolchain.run(dir, List.of("bash", "--norc", ".harness.bash", script.toString()));
        Map<String, String> offered = new LinkedHashMap<>();
        for (String row : out.split("\n")) {
            int bar = row.lastIndexOf('|');
            offered.put(row.substring(0, bar), sorted(row.substring(bar + 1)));
        }
        assertEquals(CASES, offered);
    }

    @Test
    void bashCompletesAValueGivenAfterAnEqualsSign() throws IOException {
        Path script = script(Shell.BASH, ".completion.bash");
        // bash splits "--dither=t" into --dither, = and t
        String out = CToolchain.run(dir, List.of("bash", "--norc", "-c", "source " + script + "; COMP_WORDS=(rungtone"
                + " build --dither = t); COMP_CWORD=4; _rungtone; echo ${COMPREPLY[*]}; COMP_WORDS=(rungtone build"
                + " --dither =); COMP_CWORD=3; _rungtone; echo ${COMPREPLY[*]}"));
        assertEquals("tpdf\nnone rpdf tpdf\n", out);
    }

    /** fish: {@code complete -C} prints what fish would offer for a command line. */
    @Test
    void fishCompletesCommandsOptionsChoicesAndFiles() throws IOException {
        CToolchain.require("fish");
        Path script = script(Shell.FISH, ".completion.fish");
        StringBuilder b = new StringBuilder("source ").append(script).append('\n');
        for (String line : CASES.keySet()) {
            b.append("echo '>").append(line).append("'\ncomplete -C'").append(line).append("'\n");
        }
        Files.writeString(dir.resolve(".harness.fish"), b.toString());
        String out = CToolchain.run(dir, List.of("fish", "--no-config", ".harness.fish"));
        Map<String, String> offered = new LinkedHashMap<>();
        String line = null;
        StringBuilder words = new StringBuilder();
        for (String row : (out + ">").split("\n")) {
            if (row.startsWith(">")) {
                if (line != null) {
                    offered.put(line, sorted(words.toString()));
                }
                line = row.substring(1);
                words.setLength(0);
            } else {
                words.append(row.split("\t")[0]).append(' ');
            }
        }
        assertEquals(CASES, offered);
    }

    /**
     * zsh: a real interactive zsh in a pseudo-terminal (zsh's own zpty module) loads the script from
     * {@code $fpath} as {@code _rungtone}, is sent each line with a Tab, and lists what it offers.
     */
    @Test
    void zshListsTheChoicesOfAnOptionACommandsSubcommandsAndFiles() throws IOException {
        CToolchain.require("zsh");
        Path folder = Files.createDirectories(dir.resolve(".zfunc"));
        Files.writeString(folder.resolve("_rungtone"), Shell.ZSH.script(Main.newCommandLine(), "test"));
        Map<String, String> listed = zsh("fpath=(" + folder + " $fpath); autoload -Uz compinit; compinit -u -D",
                "rungtone build --dither ", "rungtone calibrate ", "rungtone completion ",
                "rungtone calibrate plan --timer ", "rungtone build --ladder ", "rungtone bu");
        assertTrue(listed.get("rungtone build --dither ").matches("(?s).*none +rpdf +tpdf.*"), listed.toString());
        assertTrue(listed.get("rungtone calibrate ").matches("(?s).*fit +-- Fit a board's readings.*plan +-- Say what"
                + " to measure.*simulate +-- Make readings.*"), listed.toString());
        assertTrue(listed.get("rungtone completion ").matches("(?s).*bash +fish +zsh.*"), listed.toString());
        assertTrue(listed.get("rungtone calibrate plan --timer ").contains("general16"), listed.toString());
        assertTrue(listed.get("rungtone build --ladder ").matches("(?s).*board\\.toml.*greenhouse\\.toml.*"),
                listed.toString());
        // one match: zsh writes it into the line
        assertTrue(listed.get("rungtone bu").contains("rungtone build "), listed.toString());
    }

    @Test
    void zshAlsoTakesTheScriptSourcedAfterCompinit() throws IOException {
        CToolchain.require("zsh");
        Path script = script(Shell.ZSH, ".completion.zsh");
        Map<String, String> listed = zsh("autoload -Uz compinit; compinit -u -D; source " + script,
                "rungtone survey --resampler ");
        assertTrue(listed.get("rungtone survey --resampler ").matches("(?s).*kaiser +tarsos.*"), listed.toString());
    }

    /** What an interactive zsh shows after each line and a Tab, escape sequences removed. */
    private Map<String, String> zsh(String setUp, String... lines) throws IOException {
        StringBuilder b = new StringBuilder("""
                zmodload zsh/zpty
                zpty z zsh -f -i
                drain() {
                    local chunk all=''
                    local -i quiet=0
                    while (( quiet < 10 )); do
                        if zpty -r -t z chunk; then all+=$chunk; quiet=0; else sleep 0.05; quiet+=1; fi
                    done
                    print -r -- "$all"
                }
                ready() {
                    local chunk all=''
                    local -i waited=0
                    while (( waited < 400 )) && [[ $all != *ready42* ]]; do
                        if zpty -r -t z chunk; then all+=$chunk; else sleep 0.05; waited+=1; fi
                    done
                }
                """);
        // the shell is ready once it has run the set-up and printed 6*7 (its echo of the line shows no 42)
        b.append("zpty -w z 'PS1=\"%% \"; setopt nobeep; LISTMAX=1000; ").append(setUp)
                .append("; print ready$((6*7))'\nready\ndrain > /dev/null\n");
        for (String line : lines) {
            b.append("print -r -- '>").append(line).append("'\nzpty -wn z '").append(line)
                    .append("'$'\\t'\ndrain\nzpty -wn z $'\\C-u'\ndrain > /dev/null\n");
        }
        b.append("zpty -d z\n");
        Files.writeString(dir.resolve(".harness.zsh"), b.toString());
        ProcessBuilder pb = new ProcessBuilder("zsh", "-f", ".harness.zsh").directory(dir.toFile())
                .redirectErrorStream(true);
        pb.environment().put("TERM", "xterm");
        pb.environment().put("COLUMNS", "200");
        String out;
        try {
            Process p = pb.start();
            out = new String(p.getInputStream().readAllBytes(), java.nio.charset.StandardCharsets.UTF_8);
            p.waitFor();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException(e);
        }
        Map<String, String> listed = new LinkedHashMap<>();
        String current = null;
        for (String row : out.replaceAll("\u001b\\[[0-9;?]*[A-Za-z]", "").replace("\r", "").split("\n")) {
            if (row.startsWith(">") && Arrays.asList(lines).contains(row.substring(1))) {
                current = row.substring(1);
                listed.put(current, "");
            } else if (current != null) {
                listed.merge(current, row + "\n", String::concat);
            }
        }
        return listed;
    }

    private static String sorted(String words) {
        return String.join(" ", new TreeSet<>(Arrays.asList(words.trim().split("\\s+")))).trim();
    }
}
