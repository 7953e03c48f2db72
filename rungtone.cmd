@echo off
rem Rungtone launcher for Windows. In a release folder it runs lib\rungtone.jar with a Java 17+ runtime: the
rem one in JAVA_HOME when that is set, else java on the PATH. In a checkout it runs target\rungtone.jar, which
rem "mvn -B -DskipTests package" builds. Put this folder on your PATH to run "rungtone" from anywhere.
setlocal
set "RUNGTONE_HOME=%~dp0"
set "RUNGTONE_JAR=%RUNGTONE_HOME%lib\rungtone.jar"
if not exist "%RUNGTONE_JAR%" set "RUNGTONE_JAR=%RUNGTONE_HOME%target\rungtone.jar"
if not exist "%RUNGTONE_JAR%" (
  echo rungtone: no lib\rungtone.jar beside this file; unpack the whole release archive, or in a checkout run: mvn -B -DskipTests package 1>&2
  exit /b 3
)
set "RUNGTONE_JAVA=java"
if defined JAVA_HOME if exist "%JAVA_HOME%\bin\java.exe" set "RUNGTONE_JAVA=%JAVA_HOME%\bin\java.exe"
rem The same heap and compiler settings as the POSIX launcher: serial collector, sample buffers straight to the
rem old generation, a 24 MB young generation, 256 MB reserved at start, the quick compiler only, no
rem performance-data file, plots drawn without a display; RUNGTONE_JAVA_OPTS comes last and wins.
"%RUNGTONE_JAVA%" -XX:+UseSerialGC -Xms256m -Xmn24m -XX:PretenureSizeThreshold=512k -XX:TieredStopAtLevel=1 -XX:-UsePerfData -Djava.awt.headless=true %RUNGTONE_JAVA_OPTS% -jar "%RUNGTONE_JAR%" %*
exit /b %ERRORLEVEL%
