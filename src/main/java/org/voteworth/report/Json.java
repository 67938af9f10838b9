package org.voteworth.report;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.util.List;
import java.util.Map;
import java.util.function.BiConsumer;
import java.util.function.Consumer;

/** A small builder for the JSON outputs: pretty-printed, one object, fields in the order written. */
public final class Json {
    private static final JsonFactory FACTORY = new JsonFactory();

    private Json() {
    }

    /** The object that {@code body} writes, as pretty-printed JSON with a final newline. */
    public static String object(Consumer<Fields> body) {
        StringWriter out = new StringWriter();
        try (JsonGenerator g = FACTORY.createGenerator(out).useDefaultPrettyPrinter()) {
            g.writeStartObject();
            body.accept(new Fields(g));
            g.writeEndObject();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        return out + "\n";
    }

    /** Writes the fields of one object. */
    public static final class Fields {
        private final JsonGenerator g;

        Fields(JsonGenerator g) {
            this.g = g;
        }

        public Fields field(String name, String value) {
            return write(() -> g.writeStringField(name, value));
        }

        public Fields field(String name, long value) {
            return write(() -> g.writeNumberField(name, value));
        }

        /** NaN and infinities are written as null (JSON has no such numbers). */
        public Fields field(String name, double value) {
            return write(() -> {
                if (Double.isFinite(value)) {
                    g.writeNumberField(name, value);
                } else {
                    g.writeNullField(name);
                }
            });
        }

        public Fields field(String name, boolean value) {
            return write(() -> g.writeBooleanField(name, value));
        }

        public Fields map(String name, Map<String, ? extends Number> values) {
            return write(() -> {
                g.writeObjectFieldStart(name);
                for (Map.Entry<String, ? extends Number> e : values.entrySet()) {
                    Number n = e.getValue();
                    if (n instanceof Double || n instanceof Float) {
                        g.writeNumberField(e.getKey(), n.doubleValue());
                    } else {
                        g.writeNumberField(e.getKey(), n.longValue());
                    }
                }
                g.writeEndObject();
            });
        }

        public Fields strings(String name, List<String> values) {
            return write(() -> {
                g.writeArrayFieldStart(name);
                for (String v : values) {
                    g.writeString(v);
                }
                g.writeEndArray();
            });
        }

        public Fields object(String name, Consumer<Fields> body) {
            return write(() -> {
                g.writeObjectFieldStart(name);
                body.accept(this);
                g.writeEndObject();
            });
        }

        public <T> Fields array(String name, List<T> items, BiConsumer<Fields, T> each) {
            return write(() -> {
                g.writeArrayFieldStart(name);
                for (T item : items) {
                    g.writeStartObject();
                    each.accept(this, item);
                    g.writeEndObject();
                }
                g.writeEndArray();
            });
        }

        /** Lets a writer stream its own structure into this object through the generator. */
        public Fields stream(Streamer s) {
            return write(() -> s.write(g));
        }

        private Fields write(IoAction a) {
            try {
                a.run();
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            return this;
        }
    }

    /** Writes part of an object straight to the generator. */
    @FunctionalInterface
    public interface Streamer {
        void write(JsonGenerator g) throws IOException;
    }

    @FunctionalInterface
    private interface IoAction {
        void run() throws IOException;
    }
}
