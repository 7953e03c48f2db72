# arm-none-eabi.cmake: CMake toolchain file for the Cortex-M example of Rungtone's firmware examples
# (Debian's gcc-arm-none-eabi; no C library is needed).
#
# Licence of this file: MIT. Permission is hereby granted, free of charge, to any person obtaining a copy
# of this file, to deal in it without restriction, including without limitation the rights to use, copy,
# modify, merge, publish, distribute, sublicense, and/or sell copies, in source or binary form.
# THE FILE IS PROVIDED "AS IS", WITHOUT WARRANTY OF ANY KIND.
#
#   cmake -S . -B build -DCMAKE_TOOLCHAIN_FILE=arm-none-eabi.cmake
set(CMAKE_SYSTEM_NAME Generic)
set(CMAKE_SYSTEM_PROCESSOR arm)
set(CMAKE_C_COMPILER arm-none-eabi-gcc)
set(CMAKE_OBJCOPY arm-none-eabi-objcopy CACHE FILEPATH "objcopy for the target")
set(CMAKE_SIZE arm-none-eabi-size CACHE FILEPATH "size for the target")
# The compiler check builds a library, not a program: without a C library a test program would not link.
set(CMAKE_TRY_COMPILE_TARGET_TYPE STATIC_LIBRARY)
set(CMAKE_FIND_ROOT_PATH_MODE_PROGRAM NEVER)
set(CMAKE_FIND_ROOT_PATH_MODE_LIBRARY ONLY)
set(CMAKE_FIND_ROOT_PATH_MODE_INCLUDE ONLY)
