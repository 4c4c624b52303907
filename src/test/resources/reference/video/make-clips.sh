#!/bin/sh
# Makes the reference clips from frames/frame_000.png ... frame_023.png with Debian's ffmpeg (see PROVENANCE.md).
set -e
F="-hide_banner -loglevel error -y -framerate 10 -i frames/frame_%03d.png"
ffmpeg $F -c:v libx264 -preset medium -crf 16 -g 8 -pix_fmt yuv420p -movflags +faststart h264.mp4
ffmpeg $F -c:v libx265 -preset medium -crf 16 -g 8 -pix_fmt yuv420p -tag:v hvc1 -x265-params log-level=error hevc.mp4
ffmpeg $F -c:v mjpeg -q:v 3 -pix_fmt yuvj420p mjpeg.avi
ffmpeg $F -c:v libx264 -preset medium -crf 16 -g 8 -pix_fmt yuvj420p -color_range pc h264-fullrange.mkv
ffmpeg -hide_banner -loglevel error -y -i h264.mp4 -c copy h264.mov
ffmpeg $F -c:v libvpx-vp9 -crf 24 -b:v 0 -g 8 -pix_fmt yuv420p vp9.webm
ffmpeg $F -c:v libaom-av1 -crf 24 -cpu-used 8 -g 8 -pix_fmt yuv420p av1.mkv
ffmpeg $F -f lavfi -i sine=frequency=440:duration=2.4 -c:v libx264 -preset medium -crf 16 -g 8 -pix_fmt yuv420p -c:a aac -b:a 32k -shortest h264-aac.mp4
ffmpeg -hide_banner -loglevel error -y -f lavfi -i sine=frequency=440:duration=0.8 -c:a aac -b:a 32k audio-only.m4a
