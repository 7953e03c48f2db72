package org.rungtone.internal;

import java.util.function.Function;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A user-fixable problem with one setting. Its text is a template in which {@code {quantize.rate}} stands for a
 * setting's name; whoever knows where the user typed it renders the names: the command line as options
 * ({@code --rate}), a project reader as keys after {@code FILE:LINE:}. {@link #getMessage()} shows the keys.
 */
public final class SettingError extends InputError {
    private static final long serialVersionUID = 1L;
    /** Stands for a brace of the user's own text in a template until it is rendered. */
    static final String OPEN_BRACE = "\u0001";
    private static final Pattern REF = Pattern.compile("\\{([a-z_]+\\.[a-z_]+)\\}");

    private final Setting setting;
    private final String template;

    /**
     * Creates an error about {@code setting}.
     *
     * @param template the message with {@link Setting#ref()} place-holders
     * @param cause the underlying exception, or null
     */
    public SettingError(Setting setting, String template, Throwable cause) {
        super(render(template, Setting::key), cause);
        this.setting = setting;
        this.template = template;
    }

    /** The setting the error is about. */
    public Setting setting() {
        return setting;
    }

    /** The message with every place-holder replaced by {@code nameOf} of its setting. */
    public String render(Function<Setting, String> nameOf) {
        return oneLine(render(template, nameOf));
    }

    /**
     * The message without its leading setting name, for a reader that names the setting itself
     * ({@code FILE:LINE: quantize.rate: must be ...}); other names rendered by {@code nameOf}.
     */
    public String detail(Function<Setting, String> nameOf) {
        String lead = setting.ref() + " ";
        String body = template.startsWith(lead) ? template.substring(lead.length()) : template;
        return oneLine(render(body, nameOf));
    }

    /** The same error about another setting (a value typed for one option checked under another's rule). */
    public SettingError about(Setting other) {
        return new SettingError(other, template.replace(setting.ref(), other.ref()), getCause());
    }

    private static String render(String template, Function<Setting, String> nameOf) {
        Matcher m = REF.matcher(template);
        StringBuilder b = new StringBuilder();
        while (m.find()) {
            String key = m.group(1);
            String name = Setting.ofKey(key).map(nameOf).orElse(m.group());
            m.appendReplacement(b, Matcher.quoteReplacement(name));
        }
        m.appendTail(b);
        return b.toString().replace(OPEN_BRACE, "{");
    }
}
