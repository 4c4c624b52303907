package org.targetbench.source;

import boofcv.struct.image.GrayF32;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.targetbench.TestScenes;

import javax.imageio.ImageIO;
import java.io.ByteArrayOutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

import static org.junit.jupiter.api.Assertions.*;

/**
 * A Motion-JPEG frame cut short is skipped and counted, also when the cut frame still ends with an end-of-image
 * marker (the decoder's "premature end of data segment" warning gives it away), never decoded as a partly grey frame.
 */
class StrictDecodingTest {
    @TempDir Path tmp;

    static byte[] jpeg(GrayF32 g) throws Exception {
        ByteArrayOutputStream bo = new ByteArrayOutputStream();
        ImageIO.write(ImageFiles.toBuffered(g), "jpg", bo);
        return bo.toByteArray();
    }

    @Test
    void aCutFrameEndingWithEoiIsSkippedAndCounted() throws Exception {
        ByteArrayOutputStream clip = new ByteArrayOutputStream();
        for (int i = 0; i < 6; i++) {
            byte[] j = jpeg(TestScenes.texture(80, 60, 10 + i));
            if (i == 3) {
                byte[] cut = Arrays.copyOf(j, j.length / 2 + 2);
                cut[cut.length - 2] = (byte) 0xFF;
                cut[cut.length - 1] = (byte) 0xD9;
                j = cut;
            }
            clip.write(j);
        }
        Path video = tmp.resolve("clip.mjpeg");
        Files.write(video, clip.toByteArray());
        try (MjpegSource s = MjpegSource.open(video, null)) {
            List<Integer> idx = new ArrayList<>();
            Optional<SourceFrame> f;
            while ((f = s.next()).isPresent()) idx.add(f.get().index());
            assertEquals(List.of(0, 1, 2, 4, 5), idx);
            assertEquals(1, s.skippedFrames());
        }
    }

    @Test
    void endOfImageMarkerIsChecked() {
        assertTrue(StrictImage.endsWithEoi(new byte[]{(byte) 0xFF, (byte) 0xD8, 1, (byte) 0xFF, (byte) 0xD9, 0, 0}));
        assertFalse(StrictImage.endsWithEoi(new byte[]{(byte) 0xFF, (byte) 0xD8, 1, 2, 3}));
    }
}
