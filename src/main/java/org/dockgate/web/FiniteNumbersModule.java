package org.dockgate.web;

import org.dockgate.platform.StoredJson;
import org.springframework.stereotype.Component;
import tools.jackson.core.JsonParser;
import tools.jackson.databind.DeserializationContext;
import tools.jackson.databind.deser.jdk.NumberDeserializers;
import tools.jackson.databind.exc.InvalidFormatException;
import tools.jackson.databind.module.SimpleModule;

/**
 * Refuses numbers that are not finite while the JSON is read, so the answer names the field: a string
 * {@code "NaN"} or {@code "Infinity"} (which the parser would accept for a number) and a literal beyond
 * double precision such as {@code 1e999} (which it would read as infinity). Raw {@code NaN} tokens are
 * already refused by the parser (JSON has no such literal). Registered with the application's JSON
 * mapper as a module bean. JSON read back from the database ({@link StoredJson}) is exempt: the
 * application wrote it, and a frozen result may hold ν = ∞.
 */
@Component
public class FiniteNumbersModule extends SimpleModule {

    FiniteNumbersModule() {
        super("dockgate-finite-numbers");
        addDeserializer(Double.class, new FiniteDouble(Double.class, null));
        addDeserializer(Double.TYPE, new FiniteDouble(Double.TYPE, 0d));
    }

    /**
     * Whether a read failed because a number was not finite, for code that converts a JSON tree itself and
     * words its own message.
     *
     * @param e the failure
     * @return whether it is this module's refusal
     */
    public static boolean notFinite(Throwable e) {
        return e instanceof NotFiniteException;
    }

    /** A number that reads as NaN or ±infinity; {@code getValue()} is the text that was sent. */
    static final class NotFiniteException extends InvalidFormatException {
        NotFiniteException(JsonParser p, String text) {
            super(p, "not a finite number", text, Double.class);
        }
    }

    private static final class FiniteDouble extends NumberDeserializers.DoubleDeserializer {
        FiniteDouble(Class<Double> type, Double nullValue) {
            super(type, nullValue);
        }

        @Override
        public Double deserialize(JsonParser p, DeserializationContext ctxt) {
            String text = p.currentToken() != null && p.currentToken().isScalarValue() ? p.getString() : null;
            Double value = super.deserialize(p, ctxt);
            if (value != null && !Double.isFinite(value) && ctxt.getAttribute(StoredJson.STORED_RECORD) == null) {
                throw new NotFiniteException(p, text);
            }
            return value;
        }
    }
}
