package org.dockgate.platform;

import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.ObjectReader;
import tools.jackson.databind.json.JsonMapper;

/**
 * Readers for JSON the application wrote itself into the database (frozen results, procedure content,
 * specifications). Request bodies refuse numbers that are not finite; a stored record may legitimately hold
 * them (ν_eff = ∞ of a Type B budget, a TUR without a finite value in a record approved before that was
 * left out), and refusing them there would make an existing record unreadable. The web layer's number check
 * looks for {@link #STORED_RECORD} and lets such values through.
 */
public final class StoredJson {

    /** The reader attribute that marks JSON read back from the database. */
    public static final String STORED_RECORD = "dockgate.stored-record";

    private StoredJson() {
    }

    /**
     * A reader for a stored record of a type; unknown properties are ignored so that a record written by an
     * older release, or one with fields since removed, still reads.
     *
     * @param json the application's mapper
     * @param type the record's type
     * @return the reader
     */
    public static ObjectReader reader(JsonMapper json, Class<?> type) {
        return json.readerFor(type).withAttribute(STORED_RECORD, Boolean.TRUE)
                .without(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);
    }

    /**
     * A reader for a stored record of a generic type.
     *
     * @param json the application's mapper
     * @param type the type
     * @return the reader
     */
    public static ObjectReader reader(JsonMapper json, tools.jackson.core.type.TypeReference<?> type) {
        return json.readerFor(type).withAttribute(STORED_RECORD, Boolean.TRUE)
                .without(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES);
    }

    /**
     * Reads a stored record.
     *
     * @param json the application's mapper
     * @param type the record's type
     * @param text the stored JSON
     * @param <T>  the type
     * @return the record
     */
    public static <T> T read(JsonMapper json, Class<T> type, String text) {
        return reader(json, type).readValue(text);
    }
}
