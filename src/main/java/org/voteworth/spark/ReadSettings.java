package org.voteworth.spark;

import java.io.Serializable;
import java.util.LinkedHashMap;
import java.util.Map;
import org.voteworth.source.CategoryFromName;
import org.voteworth.source.Field;
import org.voteworth.source.Format;
import org.voteworth.source.HeaderMapping;
import org.voteworth.source.SourceOptions;

/**
 * {@link SourceOptions} in a form that travels to the executors: the format, the explicit
 * {@code field=header} entries, the category pattern and the reject limit. Each task rebuilds
 * the same options from it, so every executor reads rows exactly as the driver was told to.
 *
 * @param format TSV or CSV
 * @param overrides field key → header name, the explicit mapping entries
 * @param categoryPattern the {@code --category-pattern} expression (or the default one)
 * @param maxRejectRate the per-file reject limit
 */
record ReadSettings(Format format, Map<String, String> overrides, String categoryPattern, double maxRejectRate)
        implements Serializable {
    ReadSettings {
        overrides = new LinkedHashMap<>(overrides);
    }

    /**
     * @throws IllegalArgumentException when a header name holds a comma, which the rebuilt
     *     {@code --map} entries cannot carry
     */
    static ReadSettings of(SourceOptions o) {
        Map<String, String> m = new LinkedHashMap<>();
        for (Map.Entry<Field, String> e : o.mapping().overrides().entrySet()) {
            if (e.getValue().indexOf(',') >= 0) {
                throw new IllegalArgumentException("the cluster job cannot map " + e.getKey().key() + " to the header '"
                        + e.getValue() + "': it holds a comma; rename that column or map it by another header");
            }
            m.put(e.getKey().key(), e.getValue());
        }
        return new ReadSettings(o.format(), m, o.categories().pattern().pattern(), o.maxRejectRate());
    }

    SourceOptions options() {
        HeaderMapping mapping = HeaderMapping.defaults();
        for (Map.Entry<String, String> e : overrides.entrySet()) {
            mapping = mapping.withOverrides(HeaderMapping.parse(e.getKey() + "=" + e.getValue()));
        }
        return new SourceOptions(format, mapping, CategoryFromName.of(categoryPattern), maxRejectRate);
    }
}
