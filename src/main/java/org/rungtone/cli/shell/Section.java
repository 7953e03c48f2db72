package org.rungtone.cli.shell;

import java.lang.annotation.ElementType;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;

/**
 * The heading an option is listed under in help: on an option's field, or on an options class (a mixin) for
 * all of its options. Read only when help is printed ({@link HelpSections}), never when a command runs.
 */
@Retention(RetentionPolicy.RUNTIME)
@Target({ElementType.FIELD, ElementType.TYPE})
public @interface Section {
    /** The heading. */
    Heading value();
}
