package org.rungtone.cli.shell;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.rungtone.cli.shell.CompletionTree.Kind;
import org.rungtone.cli.shell.CompletionTree.Opt;
import org.rungtone.cli.shell.CompletionTree.Values;

/**
 * A bash completion script: one function registered with {@code complete -F} that walks the words before the
 * cursor (subcommands lengthen the command path; an option's value is skipped, whether given as
 * {@code --rate 16k} or {@code --rate=16k}) and then offers an option's words or file names, the command's
 * options, its subcommands, or its operands. The command model is written into four small lookup functions
 * of {@code case} statements, so the script needs no associative arrays.
 */
final class BashScript {
    private BashScript() {
    }

    /** The script for the tree's tool, naming the version that wrote it. */
    static String of(CompletionTree root, String version) {
        String tool = root.name();
        String fn = "_" + Words.identifier(tool);
        StringBuilder b = new StringBuilder();
        b.append(Words.scriptHeader("bash", tool, version))
                .append("# Load it with: source <(").append(tool).append(" completion bash)\n\n");
        lookups(b, root, fn);
        b.append(OFFER.replace("_T", fn)).append('\n').append(MAIN.replace("_T", fn))
                .append("complete -F ").append(fn).append(' ').append(tool).append('\n');
        return b.toString();
    }

    private static void lookups(StringBuilder b, CompletionTree root, String fn) {
        Map<String, String> commands = new LinkedHashMap<>();
        Map<String, String> options = new LinkedHashMap<>();
        Map<String, List<String>> takes = new LinkedHashMap<>();
        Map<String, String> operands = new LinkedHashMap<>();
        for (CompletionTree c : root.all()) {
            if (!c.subcommands().isEmpty()) {
                commands.put(c.key(), String.join(" ", Words.safe(c.subcommands().stream().map(CompletionTree::name)
                        .toList())));
            }
            List<String> names = new ArrayList<>();
            for (Opt o : c.options()) {
                names.addAll(Words.safe(o.names()));
                if (o.values().kind() != Kind.NONE) {
                    for (String name : o.names()) {
                        takes.computeIfAbsent(kind(o.values()), k -> new ArrayList<>()).add(c.key() + " " + name);
                    }
                }
            }
            options.put(c.key(), String.join(" ", names));
            if (c.maxOperands() > 0) {
                operands.put(c.key(), c.maxOperands() + " " + kind(c.operands()));
            }
        }
        b.append("# The subcommands of command path $1 (the names below the tool's), in REPLY.\n");
        lookup(b, fn + "_commands", "$1", invert(commands));
        b.append("# The options of command path $1, in REPLY.\n");
        lookup(b, fn + "_options", "$1", invert(options));
        b.append("# What option $2 of command path $1 takes, in REPLY: text, file, words WORD..., or nothing.\n");
        lookup(b, fn + "_takes", "$1 $2", takes);
        b.append("# How many operands command path $1 takes and what they are, in REPLY: COUNT KIND [WORD...].\n");
        lookup(b, fn + "_operands", "$1", invert(operands));
    }

    /** The kind as the script's lookups spell it. */
    private static String kind(Values v) {
        return switch (v.kind()) {
            case FILE -> "file";
            case WORDS -> "words " + String.join(" ", Words.safe(v.words()));
            default -> "text";
        };
    }

    /** Groups keys by their value, so a value shared by many keys is written once. */
    private static Map<String, List<String>> invert(Map<String, String> byKey) {
        Map<String, List<String>> byValue = new LinkedHashMap<>();
        byKey.forEach((key, value) -> byValue.computeIfAbsent(value, v -> new ArrayList<>()).add(key));
        return byValue;
    }

    private static void lookup(StringBuilder b, String name, String subject, Map<String, List<String>> byValue) {
        b.append(name).append("() {\n    case \"").append(subject).append("\" in\n");
        byValue.forEach((value, keys) -> {
            b.append("        ");
            for (int i = 0; i < keys.size(); i++) {
                b.append(i == 0 ? "" : "|").append('"').append(Words.safe(keys.get(i))).append('"');
            }
            b.append(") REPLY=\"").append(value).append("\" ;;\n");
        });
        b.append("        *) REPLY=\"\" ;;\n    esac\n}\n\n");
    }

    private static final String OFFER = """
            # Offers the completions of $2 of kind $1 (file, or words WORD...), each prefixed with $3.
            _T_offer() {
                local line
                COMPREPLY=()
                case "$1" in
                    file)
                        compopt -o filenames 2>/dev/null
                        while IFS= read -r line; do COMPREPLY+=("$3$line"); done < <(compgen -f -- "$2")
                        ;;
                    words\\ *)
                        while IFS= read -r line; do COMPREPLY+=("$3$line"); done < <(compgen -W "${1#words }" -- "$2")
                        ;;
                esac
            }
            """;

    private static final String MAIN = """
            _T() {
                local cur="${COMP_WORDS[COMP_CWORD]}" prev="" path="" word option="" prefix="" operands=0 i=1
                [ "$COMP_CWORD" -gt 0 ] && prev="${COMP_WORDS[COMP_CWORD-1]}"
                # The words before the cursor: subcommands lengthen the path, options' values are skipped
                # (bash splits --rate=16k into --rate, =, 16k), anything else is an operand.
                while [ "$i" -lt "$COMP_CWORD" ]; do
                    word="${COMP_WORDS[i]}"
                    if [ "$word" = "=" ]; then
                        i=$((i + 2))
                        continue
                    fi
                    case "$word" in
                        -*)
                            _T_takes "$path" "$word"
                            if [ -n "$REPLY" ] && [ "${COMP_WORDS[i+1]}" != "=" ]; then
                                i=$((i + 1))
                            fi
                            ;;
                        *)
                            _T_commands "$path"
                            if [ "$operands" -eq 0 ] && [[ " $REPLY " == *" $word "* ]]; then
                                path="${path:+$path }$word"
                            else
                                operands=$((operands + 1))
                            fi
                            ;;
                    esac
                    i=$((i + 1))
                done
                # The word under the cursor: an option's value, an option, a subcommand or an operand.
                if [ "$cur" = "=" ]; then
                    option="$prev"
                    cur=""
                elif [ "$prev" = "=" ] && [ "$COMP_CWORD" -ge 2 ]; then
                    option="${COMP_WORDS[COMP_CWORD-2]}"
                elif [[ "$cur" == --*=* ]]; then
                    option="${cur%%=*}"
                    prefix="$option="
                    cur="${cur#*=}"
                elif [[ "$prev" == -* ]]; then
                    _T_takes "$path" "$prev"
                    [ -n "$REPLY" ] && option="$prev"
                fi
                if [ -n "$option" ]; then
                    _T_takes "$path" "$option"
                    _T_offer "$REPLY" "$cur" "$prefix"
                    return 0
                fi
                _T_commands "$path"
                if [[ "$cur" != -* ]] && [ -n "$REPLY" ] && [ "$operands" -eq 0 ]; then
                    _T_offer "words $REPLY" "$cur" ""
                    return 0
                fi
                _T_operands "$path"
                if [[ "$cur" != -* ]] && [ -n "$REPLY" ] && [ "$operands" -lt "${REPLY%% *}" ]; then
                    _T_offer "${REPLY#* }" "$cur" ""
                    return 0
                fi
                _T_options "$path"
                _T_offer "words $REPLY" "$cur" ""
            }
            """;
}
