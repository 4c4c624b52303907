package org.targetbench.report;

/** Small HTML helpers for the self-contained reports. */
public final class Html {
    private Html() {}

    public static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }

    /** Shared page head with the report style sheet. */
    public static String head(String title) {
        return "<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"><title>" + esc(title) + "</title>\n<style>\n"
                + "body{font-family:system-ui,-apple-system,'Segoe UI',sans-serif;margin:2em auto;max-width:1100px;color:#222;line-height:1.4}\n"
                + "h1{font-size:1.6em;margin-bottom:.2em}h2{font-size:1.25em;border-bottom:1px solid #ddd;padding-bottom:.2em;margin-top:1.6em}\n"
                + "table{border-collapse:collapse;margin:.6em 0}td,th{border:1px solid #ccc;padding:.25em .6em;text-align:left}\n"
                + "th{background:#f2f4f7}td.num{text-align:right;font-variant-numeric:tabular-nums}\n"
                + ".safety{background:#fff6e0;border-left:5px solid #e0a000;padding:.6em 1em;margin:1em 0}\n"
                + ".muted{color:#666;font-size:.9em}.charts img{margin:.3em;border:1px solid #eee}\n"
                + ".swatch{display:inline-block;width:.9em;height:.9em;border-radius:50%;border:2px solid #000;vertical-align:middle;margin-right:.3em}\n"
                + "</style></head><body>\n";
    }

    public static String safety(String notice) {
        return "<div class=\"safety\"><strong>Safety.</strong> " + esc(notice) + "</div>\n";
    }

    public static String img(byte[] png, String alt) {
        return "<img src=\"" + Charts.dataUri(png) + "\" alt=\"" + esc(alt) + "\">";
    }

    public static String swatch(java.awt.Color c) {
        return String.format("<span class=\"swatch\" style=\"background:#%02x%02x%02x\"></span>", c.getRed(), c.getGreen(), c.getBlue());
    }
}
